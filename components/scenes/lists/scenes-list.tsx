'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { apiFetch } from '@/lib/api/client';
import { NameForm } from './name-form';
import { ArchivableList, useArchivable } from './archivable-list';

type Scene = { id: string; name: string; slug: string; archived: boolean; latestRevision: number; updatedAt: string };

const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** A show's scenes; a new scene opens straight in the editor. */
export function ScenesList({ studio, showId, canWrite }: { studio: string; showId: string; canWrite: boolean }) {
  const router = useRouter();
  const base = `/api/v1/studios/${studio}/shows/${showId}/scenes`;
  const { state, refresh } = useArchivable<Scene, { scenes: Scene[] }>({
    queryKey: ['studio', studio, 'show', showId, 'scenes'],
    refreshKey: ['studio', studio, 'show', showId],
    listUrl: base,
    pick: (response) => response.scenes,
    itemUrl: (scene) => `/api/v1/studios/${studio}/scenes/${scene.id}`,
  });
  const editorHref = (id: string) => `/studios/${studio}/shows/${showId}/scenes/${id}`;

  return (
    <div className="space-y-4">
      {canWrite ? (
        <NameForm
          label="New scene"
          submitLabel="Create scene"
          testId="new-scene"
          onCreate={async (name) => {
            const created = await apiFetch<{ scene: Scene }>(base, { method: 'POST', body: { name } });
            await refresh();
            router.push(editorHref(created.scene.id));
          }}
        />
      ) : null}
      <ArchivableList plural="scenes" state={state} empty="No scenes in this show yet." testId="scenes-list" itemTestId={(scene) => `scene-${scene.slug}`} canWrite={canWrite}>
        {(scene) => (
          <>
            <Link href={editorHref(scene.id)} className="font-medium text-slate-200 hover:text-teal-300">{scene.name}</Link>
            <p className="text-xs text-slate-500">
              revision {scene.latestRevision} · updated {dateFormat.format(new Date(scene.updatedAt))}
              {scene.archived ? ' · archived' : ''}
            </p>
          </>
        )}
      </ArchivableList>
    </div>
  );
}

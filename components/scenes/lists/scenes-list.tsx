'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { NameForm } from './name-form';
import { ArchivableList } from './archivable-list';

type Scene = { id: string; name: string; slug: string; archived: boolean; latestRevision: number; updatedAt: string };

const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** A show's scenes; a new scene opens straight in the editor. */
export function ScenesList({ studio, showId, canWrite }: { studio: string; showId: string; canWrite: boolean }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [showArchived, setShowArchived] = useState(false);
  const base = `/api/v1/studios/${studio}/shows/${showId}/scenes`;
  const scenes = useQuery({
    queryKey: ['studio', studio, 'show', showId, 'scenes', showArchived],
    queryFn: () => apiFetch<{ scenes: Scene[] }>(`${base}${showArchived ? '?archived=include' : ''}`),
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['studio', studio, 'show', showId] });
  const archive = useMutation({
    mutationFn: (scene: Scene) => apiFetch(`/api/v1/studios/${studio}/scenes/${scene.id}`, { method: 'PATCH', body: { archived: !scene.archived } }),
    onSettled: refresh,
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
      <ArchivableList
        plural="scenes"
        items={scenes.data?.scenes}
        loading={scenes.isPending}
        error={scenes.isError ? scenes.error.message : null}
        empty="No scenes in this show yet."
        testId="scenes-list"
        itemTestId={(scene) => `scene-${scene.slug}`}
        showArchived={showArchived}
        onShowArchived={setShowArchived}
        canWrite={canWrite}
        onToggleArchive={(scene) => archive.mutate(scene)}
        archiving={archive.isPending}
        archiveError={archive.isError ? archive.error.message : null}
      >
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

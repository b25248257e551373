'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { NameForm } from './name-form';

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
      <label className="flex items-center gap-2 text-sm text-slate-400">
        <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} className="accent-teal-400" />
        Include archived scenes
      </label>
      {archive.isError ? <Alert tone="error">{archive.error.message}</Alert> : null}
      {scenes.isPending ? <p className="text-sm text-slate-400">Loading scenes…</p> : null}
      {scenes.isError ? <Alert tone="error">{scenes.error.message}</Alert> : null}
      {scenes.data && scenes.data.scenes.length === 0 ? <p className="text-sm text-slate-400">No scenes in this show yet.</p> : null}
      {scenes.data && scenes.data.scenes.length > 0 ? (
        <ul className="divide-y divide-ink-700 rounded-md border border-ink-700" data-testid="scenes-list">
          {scenes.data.scenes.map((scene) => (
            <li key={scene.id} className="flex items-center justify-between gap-4 px-4 py-3" data-testid={`scene-${scene.slug}`}>
              <div>
                <Link href={editorHref(scene.id)} className="font-medium text-slate-200 hover:text-teal-300">{scene.name}</Link>
                <p className="text-xs text-slate-500">
                  revision {scene.latestRevision} · updated {dateFormat.format(new Date(scene.updatedAt))}
                  {scene.archived ? ' · archived' : ''}
                </p>
              </div>
              {canWrite ? (
                <button type="button" className="text-sm text-slate-400 hover:text-teal-300" onClick={() => archive.mutate(scene)} disabled={archive.isPending}>
                  {scene.archived ? 'Restore' : 'Archive'}
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

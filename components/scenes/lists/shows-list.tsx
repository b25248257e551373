'use client';

import Link from 'next/link';
import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { NameForm } from './name-form';

type Show = { id: string; name: string; archived: boolean; sceneCount: number; createdAt: string };

/** The shows table, with "new show" for those who may write and archive/restore beside each show. */
export function ShowsList({ studio, canWrite, canOpenScenes }: { studio: string; canWrite: boolean; canOpenScenes: boolean }) {
  const queryClient = useQueryClient();
  const [showArchived, setShowArchived] = useState(false);
  const base = `/api/v1/studios/${studio}/shows`;
  const shows = useQuery({
    queryKey: ['studio', studio, 'shows', showArchived],
    queryFn: () => apiFetch<{ shows: Show[] }>(`${base}${showArchived ? '?archived=include' : ''}`),
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['studio', studio, 'shows'] });
  const archive = useMutation({
    mutationFn: (show: Show) => apiFetch(`${base}/${show.id}`, { method: 'PATCH', body: { archived: !show.archived } }),
    onSettled: refresh,
  });

  return (
    <div className="space-y-4">
      {canWrite ? (
        <NameForm
          label="New show"
          submitLabel="Create show"
          testId="new-show"
          onCreate={async (name) => {
            await apiFetch(base, { method: 'POST', body: { name } });
            await refresh();
          }}
        />
      ) : null}
      <label className="flex items-center gap-2 text-sm text-slate-400">
        <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} className="accent-teal-400" />
        Include archived shows
      </label>
      {archive.isError ? <Alert tone="error">{archive.error.message}</Alert> : null}
      {shows.isPending ? <p className="text-sm text-slate-400">Loading shows…</p> : null}
      {shows.isError ? <Alert tone="error">{shows.error.message}</Alert> : null}
      {shows.data && shows.data.shows.length === 0 ? <p className="text-sm text-slate-400">No shows yet.{canWrite ? ' Name one above to start.' : ''}</p> : null}
      {shows.data && shows.data.shows.length > 0 ? (
        <ul className="divide-y divide-ink-700 rounded-md border border-ink-700" data-testid="shows-list">
          {shows.data.shows.map((show) => (
            <li key={show.id} className="flex items-center justify-between gap-4 px-4 py-3" data-testid={`show-${show.name}`}>
              <div>
                <Link href={`/studios/${studio}/shows/${show.id}`} className="font-medium text-slate-200 hover:text-teal-300">{show.name}</Link>
                <p className="text-xs text-slate-500">
                  {canOpenScenes ? `${show.sceneCount} scene${show.sceneCount === 1 ? '' : 's'}` : 'Scenes arrive as deliveries'}
                  {show.archived ? ' · archived' : ''}
                </p>
              </div>
              {canWrite ? (
                <button type="button" className="text-sm text-slate-400 hover:text-teal-300" onClick={() => archive.mutate(show)} disabled={archive.isPending}>
                  {show.archived ? 'Restore' : 'Archive'}
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

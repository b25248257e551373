'use client';

import Link from 'next/link';
import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { NameForm } from './name-form';
import { ArchivableList } from './archivable-list';

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
      <ArchivableList
        plural="shows"
        items={shows.data?.shows}
        loading={shows.isPending}
        error={shows.isError ? shows.error.message : null}
        empty={`No shows yet.${canWrite ? ' Name one above to start.' : ''}`}
        testId="shows-list"
        itemTestId={(show) => `show-${show.name}`}
        showArchived={showArchived}
        onShowArchived={setShowArchived}
        canWrite={canWrite}
        onToggleArchive={(show) => archive.mutate(show)}
        archiving={archive.isPending}
        archiveError={archive.isError ? archive.error.message : null}
      >
        {(show) => (
          <>
            <Link href={`/studios/${studio}/shows/${show.id}`} className="font-medium text-slate-200 hover:text-teal-300">{show.name}</Link>
            <p className="text-xs text-slate-500">
              {canOpenScenes ? `${show.sceneCount} scene${show.sceneCount === 1 ? '' : 's'}` : 'Scenes arrive as deliveries'}
              {show.archived ? ' · archived' : ''}
            </p>
          </>
        )}
      </ArchivableList>
    </div>
  );
}

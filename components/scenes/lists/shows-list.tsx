'use client';

import Link from 'next/link';
import { apiFetch } from '@/lib/api/client';
import { NameForm } from './name-form';
import { ArchivableList, useArchivable } from './archivable-list';

type Show = { id: string; name: string; archived: boolean; sceneCount: number; createdAt: string };

/** The shows table, with "new show" for those who may write and archive/restore beside each show. */
export function ShowsList({ studio, canWrite, canOpenScenes }: { studio: string; canWrite: boolean; canOpenScenes: boolean }) {
  const base = `/api/v1/studios/${studio}/shows`;
  const { state, refresh } = useArchivable<Show, { shows: Show[] }>({
    queryKey: ['studio', studio, 'shows'],
    refreshKey: ['studio', studio, 'shows'],
    listUrl: base,
    pick: (response) => response.shows,
    itemUrl: (show) => `${base}/${show.id}`,
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
      <ArchivableList plural="shows" state={state} empty={`No shows yet.${canWrite ? ' Name one above to start.' : ''}`} testId="shows-list" itemTestId={(show) => `show-${show.name}`} canWrite={canWrite}>
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

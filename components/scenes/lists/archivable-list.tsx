'use client';

import { useState, type ReactNode } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';

/** An item the list can archive and restore. */
type Archivable = { id: string; archived: boolean };

/** What the list shows and does: its items with their loading state, the archived switch, archive/restore. */
export interface ArchivableState<T> {
  items: T[] | undefined;
  loading: boolean;
  error: string | null;
  showArchived: boolean;
  setShowArchived: (include: boolean) => void;
  toggleArchive: (item: T) => void;
  archiving: boolean;
  archiveError: string | null;
}

/**
 * The query and archive mutation behind an ArchivableList (shows, scenes).
 * @param queryKey cache key of the list (the archived switch is appended)
 * @param refreshKey prefix invalidated after a change (the list and what counts its items)
 * @param listUrl GET endpoint of the list; `?archived=include` adds archived items
 * @param pick the items in the endpoint's response
 * @param itemUrl PATCH endpoint of one item
 * @returns the list's state and a refresh for other changes (e.g. a new item)
 */
export function useArchivable<T extends Archivable, R>({
  queryKey,
  refreshKey,
  listUrl,
  pick,
  itemUrl,
}: {
  queryKey: unknown[];
  refreshKey: unknown[];
  listUrl: string;
  pick: (response: R) => T[];
  itemUrl: (item: T) => string;
}): { state: ArchivableState<T>; refresh: () => Promise<void> } {
  const queryClient = useQueryClient();
  const [showArchived, setShowArchived] = useState(false);
  const list = useQuery({ queryKey: [...queryKey, showArchived], queryFn: () => apiFetch<R>(`${listUrl}${showArchived ? '?archived=include' : ''}`) });
  const refresh = () => queryClient.invalidateQueries({ queryKey: refreshKey });
  const archive = useMutation({
    mutationFn: (item: T) => apiFetch(itemUrl(item), { method: 'PATCH', body: { archived: !item.archived } }),
    onSettled: refresh,
  });
  return {
    state: {
      items: list.data ? pick(list.data) : undefined,
      loading: list.isPending,
      error: list.isError ? list.error.message : null,
      showArchived,
      setShowArchived,
      toggleArchive: (item) => archive.mutate(item),
      archiving: archive.isPending,
      archiveError: archive.isError ? archive.error.message : null,
    },
    refresh,
  };
}

/**
 * The list body shared by shows and scenes: the "include archived" switch,
 * loading, error and empty states, and one row per item with archive/restore
 * for those who may write.
 */
export function ArchivableList<T extends Archivable>({
  plural,
  state,
  empty,
  testId,
  itemTestId,
  canWrite,
  children,
}: {
  /** "shows", "scenes" */
  plural: string;
  state: ArchivableState<T>;
  empty: ReactNode;
  testId: string;
  itemTestId: (item: T) => string;
  canWrite: boolean;
  /** the row's name and details */
  children: (item: T) => ReactNode;
}) {
  const { items } = state;
  return (
    <>
      <label className="flex items-center gap-2 text-sm text-slate-400">
        <input type="checkbox" checked={state.showArchived} onChange={(e) => state.setShowArchived(e.target.checked)} className="accent-teal-400" />
        Include archived {plural}
      </label>
      {state.archiveError ? <Alert tone="error">{state.archiveError}</Alert> : null}
      {state.loading ? <p className="text-sm text-slate-400">Loading {plural}…</p> : null}
      {state.error ? <Alert tone="error">{state.error}</Alert> : null}
      {items && items.length === 0 ? <p className="text-sm text-slate-400">{empty}</p> : null}
      {items && items.length > 0 ? (
        <ul className="divide-y divide-ink-700 rounded-md border border-ink-700" data-testid={testId}>
          {items.map((item) => (
            <li key={item.id} className="flex items-center justify-between gap-4 px-4 py-3" data-testid={itemTestId(item)}>
              <div>{children(item)}</div>
              {canWrite ? (
                <button type="button" className="text-sm text-slate-400 hover:text-teal-300" onClick={() => state.toggleArchive(item)} disabled={state.archiving}>
                  {item.archived ? 'Restore' : 'Archive'}
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}

'use client';

import type { ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';

/**
 * The list body shared by shows and scenes: the "include archived" switch,
 * loading, error and empty states, and one row per item with archive/restore
 * for those who may write.
 */
export function ArchivableList<T extends { id: string; archived: boolean }>({
  plural,
  items,
  loading,
  error,
  empty,
  testId,
  itemTestId,
  showArchived,
  onShowArchived,
  canWrite,
  onToggleArchive,
  archiving,
  archiveError,
  children,
}: {
  /** "shows", "scenes" */
  plural: string;
  items: T[] | undefined;
  loading: boolean;
  error: string | null;
  empty: ReactNode;
  testId: string;
  itemTestId: (item: T) => string;
  showArchived: boolean;
  onShowArchived: (include: boolean) => void;
  canWrite: boolean;
  onToggleArchive: (item: T) => void;
  archiving: boolean;
  archiveError: string | null;
  /** the row's name and details */
  children: (item: T) => ReactNode;
}) {
  return (
    <>
      <label className="flex items-center gap-2 text-sm text-slate-400">
        <input type="checkbox" checked={showArchived} onChange={(e) => onShowArchived(e.target.checked)} className="accent-teal-400" />
        Include archived {plural}
      </label>
      {archiveError ? <Alert tone="error">{archiveError}</Alert> : null}
      {loading ? <p className="text-sm text-slate-400">Loading {plural}…</p> : null}
      {error ? <Alert tone="error">{error}</Alert> : null}
      {items && items.length === 0 ? <p className="text-sm text-slate-400">{empty}</p> : null}
      {items && items.length > 0 ? (
        <ul className="divide-y divide-ink-700 rounded-md border border-ink-700" data-testid={testId}>
          {items.map((item) => (
            <li key={item.id} className="flex items-center justify-between gap-4 px-4 py-3" data-testid={itemTestId(item)}>
              <div>{children(item)}</div>
              {canWrite ? (
                <button type="button" className="text-sm text-slate-400 hover:text-teal-300" onClick={() => onToggleArchive(item)} disabled={archiving}>
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

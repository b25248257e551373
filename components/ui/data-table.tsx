'use client';

import { flexRender, type Table } from '@tanstack/react-table';

/**
 * The studio's table look for a @tanstack/react-table instance: header row,
 * one row per record with its own test id, ruled rows.
 */
export function DataTable<T>({
  table,
  testId,
  rowTestId,
  compact = false,
  rowClassName = '',
}: {
  table: Table<T>;
  testId: string;
  /** data-testid of a record's row */
  rowTestId: (record: T) => string;
  /** smaller header text and tighter, top-aligned cells (long listings) */
  compact?: boolean;
  rowClassName?: string;
}) {
  const cell = compact ? 'py-1.5 pr-4 align-top' : 'py-2.5 pr-4';
  return (
    <table className="w-full text-left text-sm" data-testid={testId}>
      <thead className={compact ? 'text-xs text-slate-400' : 'text-slate-400'}>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((h) => (
              <th key={h.id} className="whitespace-nowrap border-b border-ink-700 py-2 pr-4 font-medium">
                {flexRender(h.column.columnDef.header, h.getContext())}
              </th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className={`border-b border-ink-700/60 ${rowClassName}`} data-testid={rowTestId(row.original)}>
            {row.getVisibleCells().map((c) => (
              <td key={c.id} className={cell}>
                {flexRender(c.column.columnDef.cell, c.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

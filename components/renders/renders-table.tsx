'use client';

import Link from 'next/link';
import { useMemo } from 'react';
import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { Alert } from '@/components/ui/alert';
import { formatLabel, formatWhen } from './format';
import { RenderProgress, RenderStatusBadge } from './render-status';
import type { RenderSummary } from './types';
import { useRenders } from './use-renders';

const column = createColumnHelper<RenderSummary>();

function framesLabel(r: RenderSummary): string {
  return r.kind === 'still' ? `frame ${r.frameStart}` : `frames ${r.frameStart}–${r.frameStart + r.frameCount - 1}`;
}

/** Every render of the studio, newest first, with live progress while workers are busy. */
export function RendersTable({ studio }: { studio: string }) {
  const renders = useRenders(studio);
  const columns = useMemo(
    () => [
      column.accessor('sceneName', {
        header: 'Scene',
        cell: (info) => (
          <Link href={`/studios/${studio}/renders/${info.row.original.id}`} className="font-medium text-slate-200 hover:text-teal-300 hover:underline" data-testid="render-link">
            {info.getValue()} <span className="text-slate-500">rev {info.row.original.revision}</span>
          </Link>
        ),
      }),
      column.accessor('kind', {
        header: 'What',
        cell: (info) => (
          <span className="text-slate-300">
            <span className="capitalize">{info.getValue()}</span> <span className="text-slate-500">· {framesLabel(info.row.original)}</span>
            {info.row.original.draft ? <span className="ml-2 rounded border border-violet-500/50 px-1 text-[10px] uppercase tracking-wider text-violet-300">draft</span> : null}
          </span>
        ),
      }),
      column.accessor('settings', {
        header: 'Output',
        cell: (info) => <span className="tabular-nums text-slate-400">{info.getValue().width}×{info.getValue().height} · {formatLabel(info.getValue().format)}</span>,
      }),
      column.display({
        id: 'progress',
        header: 'Progress',
        cell: (info) => {
          const r = info.row.original;
          return (
            <div className="w-44">
              <RenderProgress done={r.framesDone} failed={r.framesFailed} total={r.frameCount} label={`Progress of ${r.sceneName}`} testId="render-row-progress" />
            </div>
          );
        },
      }),
      column.accessor('status', { header: 'Status', cell: (info) => <RenderStatusBadge status={info.getValue()} testId="render-row-status" /> }),
      column.accessor('createdAt', { header: 'Requested', cell: (info) => <span className="text-slate-400">{formatWhen(info.getValue())}</span> }),
    ],
    [studio],
  );
  const table = useReactTable({ data: renders.data?.renders ?? [], columns, getCoreRowModel: getCoreRowModel() });

  if (renders.isPending) return <p className="text-sm text-slate-400">Loading renders…</p>;
  if (renders.isError) return <Alert tone="error">{renders.error.message}</Alert>;
  if (renders.data.renders.length === 0) return <p className="text-sm text-slate-400" data-testid="renders-empty">No renders yet. Request a still or a frame sequence of a scene revision.</p>;
  return (
    <div className="overflow-x-auto">
      <DataTable table={table} testId="renders-table" rowTestId={(r) => `render-row-${r.id}`} rowClassName="align-middle" />
    </div>
  );
}

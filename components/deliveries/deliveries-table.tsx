'use client';

import Link from 'next/link';
import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { formatWhen } from '@/components/renders/format';
import { ApprovalBadge, LoadedBadge, VerdictBadge } from './delivery-badges';
import { deliveriesKey, type DeliverySummary } from './types';

const column = createColumnHelper<DeliverySummary>();

/** Frame packages of the studio, newest first. */
export function DeliveriesTable({ studio }: { studio: string }) {
  const deliveries = useQuery({ queryKey: deliveriesKey(studio), queryFn: () => apiFetch<{ deliveries: DeliverySummary[] }>(`/api/v1/studios/${studio}/deliveries`) });
  const columns = useMemo(
    () => [
      column.accessor('scene', {
        header: 'Scene',
        cell: (info) => (
          <Link href={`/studios/${studio}/deliveries/${info.row.original.id}`} className="font-medium text-slate-200 hover:text-teal-300 hover:underline" data-testid="delivery-link">
            {info.row.original.show} / {info.getValue()} <span className="text-slate-500">rev {info.row.original.revision}</span>
          </Link>
        ),
      }),
      column.accessor('approved', { header: 'Revision', cell: (info) => <ApprovalBadge approved={info.getValue()} /> }),
      column.accessor('frames', { header: 'Frames', cell: (info) => <span className="tabular-nums text-slate-300">{info.getValue()} @ {info.row.original.frameRate} fps</span> }),
      column.accessor('resolution', { header: 'Size', cell: (info) => <span className="tabular-nums text-slate-400">{info.getValue().replace('x', '×')} · {info.row.original.projection}</span> }),
      column.accessor('photosensitivity', { header: 'Photosensitivity', cell: (info) => <VerdictBadge verdict={info.getValue()} /> }),
      column.accessor('status', { header: 'Status', cell: (info) => <LoadedBadge status={info.getValue()} /> }),
      column.accessor('createdAt', { header: 'Made', cell: (info) => <span className="text-slate-400">{formatWhen(info.getValue())}</span> }),
    ],
    [studio],
  );
  const table = useReactTable({ data: deliveries.data?.deliveries ?? [], columns, getCoreRowModel: getCoreRowModel() });
  if (deliveries.isPending) return <p className="text-sm text-slate-400">Loading deliveries…</p>;
  if (deliveries.isError) return <Alert tone="error">{deliveries.error.message}</Alert>;
  if (deliveries.data.deliveries.length === 0) return <p className="text-sm text-slate-400" data-testid="deliveries-empty">No deliveries yet. A finished frame sequence becomes a delivery once its photosensitivity check is done.</p>;
  return (
    <div className="overflow-x-auto">
      <DataTable table={table} testId="deliveries-table" rowTestId={(d) => `delivery-row-${d.id}`} />
    </div>
  );
}

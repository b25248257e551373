'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { formatBytes, formatLabel, formatNumber, formatWhen } from '@/components/renders/format';
import { PhotosensitivityResultView } from '@/components/renders/photosensitivity-result';
import type { PhotosensitivityResult } from '@/components/renders/types';
import { ApprovalBadge, LoadedBadge } from './delivery-badges';
import { deliveriesKey, downloadUrl, type DeliveryDetail, type ManifestFrame } from './types';

/** Rows shown before "Show all": long sequences have thousands of frames. */
const ROWS_SHOWN = 100;

const column = createColumnHelper<ManifestFrame>();
const num = (digits: number) => (info: { getValue: () => number | null }) => <span className="tabular-nums">{formatNumber(info.getValue(), digits)}</span>;

function FramesTable({ frames }: { frames: ManifestFrame[] }) {
  const [all, setAll] = useState(false);
  const columns = useMemo(
    () => [
      column.accessor('file', { header: 'File', cell: (info) => <span className="font-mono text-xs text-slate-300">{info.getValue()}</span> }),
      column.accessor('properTimeSeconds', { header: 'Proper time (s)', cell: num(5) }),
      column.accessor('radiusRs', { header: 'Radius (r_s)', cell: num(4) }),
      column.accessor('speedRelativeToHover', { header: 'Speed vs hover (c)', cell: num(3) }),
      column.display({ id: 'shift', header: 'Shift range', cell: (info) => <span className="tabular-nums">{formatNumber(info.row.original.shiftMin, 3)} – {formatNumber(info.row.original.shiftMax, 3)}</span> }),
      column.accessor('exposureEv', { header: 'Exposure (EV)', cell: num(3) }),
      column.accessor('bytes', { header: 'Size', cell: (info) => <span className="tabular-nums text-slate-400">{formatBytes(info.getValue())}</span> }),
      column.accessor('sha256', { header: 'SHA-256', cell: (info) => <code className="break-all font-mono text-[11px] text-slate-400" title={info.getValue()} data-testid="frame-sha256">{info.getValue()}</code> }),
    ],
    [],
  );
  const data = useMemo(() => (all ? frames : frames.slice(0, ROWS_SHOWN)), [all, frames]);
  const table = useReactTable({ data, columns, getCoreRowModel: getCoreRowModel() });
  return (
    <div className="space-y-3">
      <div className="overflow-x-auto">
        <DataTable table={table} testId="manifest-frames" rowTestId={(f) => `manifest-frame-${f.index}`} compact />
      </div>
      {!all && frames.length > ROWS_SHOWN ? <Button variant="secondary" onClick={() => setAll(true)}>Show all {frames.length} frames</Button> : null}
    </div>
  );
}

function Summary({ detail }: { detail: DeliveryDetail }) {
  const m = detail.manifest;
  const totalBytes = m.frames.reduce((sum, f) => sum + f.bytes, 0);
  const projection = m.projection as { kind?: string; apertureDeg?: number; fovDeg?: number };
  const projectionText = projection.kind === 'dome' ? `dome master, ${projection.apertureDeg ?? 180}° aperture` : projection.kind === 'flat' ? `flat, ${projection.fovDeg}° field of view` : String(projection.kind);
  const rows: [string, string, string][] = [
    ['Show / scene', `${m.scene.show} / ${m.scene.name}`, 'summary-scene'],
    ['Revision', `${m.revision.number} (content ${m.revision.contentHash.slice(0, 12)}…)`, 'summary-revision'],
    ['Frames', `${m.frames.length} at ${m.frameRate} fps (${formatNumber(m.frames.length / m.frameRate, 3)} s)`, 'summary-frames'],
    ['Size', `${m.resolution.width} × ${m.resolution.height} · ${projectionText}`, 'summary-size'],
    ['Files', `${formatLabel(m.output)} · ${formatBytes(totalBytes)} in frames`, 'summary-files'],
    ['Hole mass', `${m.massSolar.toLocaleString('en-GB', { maximumSignificantDigits: 4 })} solar masses`, 'summary-mass'],
    ['Exposure', `${formatNumber(m.exposure.ev, 3)} EV · ${m.exposure.toneMap} tone map`, 'summary-exposure'],
    ['Made', formatWhen(m.createdAt), 'summary-made'],
  ];
  return (
    <div className="space-y-4">
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]" data-testid="manifest-summary">
        {rows.map(([label, value, id]) => (
          <div key={id} className="contents">
            <dt className="text-slate-500">{label}</dt>
            <dd className="text-slate-200" data-testid={id}>{value}</dd>
          </div>
        ))}
      </dl>
      {m.nonPhysicalChoices.length ? (
        <div className="space-y-1">
          <h3 className="text-xs font-semibold uppercase tracking-wider text-slate-400">Non-physical choices in these frames</h3>
          <ul className="list-disc space-y-0.5 pl-5 text-sm text-slate-300" data-testid="non-physical-choices">
            {m.nonPhysicalChoices.map((c) => <li key={c}>{c}</li>)}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

/** A frame package: summary, download, "Mark as loaded", the per-frame manifest with checksums and the photosensitivity report. */
export function DeliveryDetailView({ studio, deliveryId, canMarkLoaded }: { studio: string; deliveryId: string; canMarkLoaded: boolean }) {
  const queryClient = useQueryClient();
  const key = [...deliveriesKey(studio), deliveryId];
  const query = useQuery({ queryKey: key, queryFn: () => apiFetch<DeliveryDetail>(`/api/v1/studios/${studio}/deliveries/${deliveryId}`) });
  const markLoaded = useMutation({
    mutationFn: () => apiFetch(`/api/v1/studios/${studio}/deliveries/${deliveryId}/loaded`, { method: 'POST' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: deliveriesKey(studio) }),
  });
  if (query.isPending) return <p className="text-sm text-slate-400">Loading delivery…</p>;
  if (query.isError) return <Alert tone="error" testId="delivery-error">{query.error.message}</Alert>;
  const { delivery, manifest } = query.data;
  return (
    <div className="max-w-6xl space-y-6" data-testid="delivery-detail">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="space-y-1">
          <p className="text-sm"><Link href={`/studios/${studio}/deliveries`} className="text-slate-400 hover:text-teal-300 hover:underline">Deliveries</Link></p>
          <h1 className="text-2xl font-semibold">{manifest.scene.name} <span className="text-slate-500">· revision {manifest.revision.number}</span></h1>
          <div className="flex items-center gap-2 text-sm"><ApprovalBadge approved={manifest.revision.approved} /><LoadedBadge status={delivery.status} />
            {delivery.loadedAt ? <span className="text-slate-400">loaded {formatWhen(delivery.loadedAt)}</span> : null}
          </div>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <a href={downloadUrl(studio, deliveryId)} download data-testid="download-delivery" className="inline-flex items-center rounded-md bg-teal-500 px-3.5 py-2 text-sm font-medium text-ink-950 hover:bg-teal-400">
            Download frame package (zip)
          </a>
          {canMarkLoaded && delivery.status !== 'loaded' ? (
            <Button variant="secondary" data-testid="mark-loaded" disabled={markLoaded.isPending} onClick={() => markLoaded.mutate()}>
              {markLoaded.isPending ? 'Saving…' : 'Mark as loaded'}
            </Button>
          ) : null}
        </div>
      </div>
      {markLoaded.isError ? <Alert tone="error" testId="mark-loaded-error">{markLoaded.error.message}</Alert> : null}
      {!manifest.revision.approved ? (
        <Alert tone="caution" testId="draft-notice">Draft — revision not approved. An advisor has not approved this scene revision; check with the producer before loading it for an audience.</Alert>
      ) : null}

      <Panel title="Manifest"><Summary detail={query.data} /></Panel>
      <Panel title="Photosensitivity report"><PhotosensitivityResultView result={manifest.photosensitivity as PhotosensitivityResult | null} /></Panel>
      <Panel title={`Frames and checksums (${manifest.frames.length})`}><FramesTable frames={manifest.frames} /></Panel>
    </div>
  );
}

'use client';

import Link from 'next/link';
import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { formatLabel, formatNumber, formatSecondsLeft, formatWhen } from './format';
import { FrameGrid } from './frame-grid';
import { FrameReadoutChart } from './frame-readout-chart';
import { PhotosensitivityResultView } from './photosensitivity-result';
import { RenderProgress, RenderStatusBadge } from './render-status';
import { isActive, type RenderDetail as Detail } from './types';
import { rendersKey, useRenderDetail } from './use-renders';

function Stat({ label, value, testId }: { label: string; value: string; testId: string }) {
  return (
    <div className="rounded-md border border-ink-700 bg-ink-900/60 px-3 py-2">
      <dt className="text-xs text-slate-500">{label}</dt>
      <dd className="text-lg tabular-nums text-slate-200" data-testid={testId}>{value}</dd>
    </div>
  );
}

function Actions({ studio, detail, canManage }: { studio: string; detail: Detail; canManage: boolean }) {
  const queryClient = useQueryClient();
  const [problem, setProblem] = useState<string | null>(null);
  const r = detail.render;
  const refresh = () => queryClient.invalidateQueries({ queryKey: rendersKey(studio) });
  const cancel = useMutation({
    mutationFn: () => apiFetch(`/api/v1/studios/${studio}/renders/${r.id}/cancel`, { method: 'POST' }),
    onMutate: () => setProblem(null),
    onError: (e) => setProblem(e.message),
    onSettled: refresh,
  });
  const retry = useMutation({
    mutationFn: () => apiFetch<{ requeued: number }>(`/api/v1/studios/${studio}/renders/${r.id}/retry`, { method: 'POST' }),
    onMutate: () => setProblem(null),
    onError: (e) => setProblem(e.message),
    onSettled: refresh,
  });
  if (!canManage) return null;
  const canRetry = r.status === 'failed' || r.status === 'cancelled' || (isActive(r.status) && r.framesFailed > 0);
  return (
    <div className="flex flex-wrap items-center gap-3">
      {isActive(r.status) ? (
        <Button variant="danger" data-testid="cancel-render" disabled={cancel.isPending} onClick={() => { if (window.confirm('Cancel this render? Frames already stored are kept.')) cancel.mutate(); }}>
          {cancel.isPending ? 'Cancelling…' : 'Cancel render'}
        </Button>
      ) : null}
      {canRetry ? (
        <Button variant="secondary" data-testid="retry-render" disabled={retry.isPending} onClick={() => retry.mutate()}>
          {retry.isPending ? 'Queuing…' : r.status === 'cancelled' ? 'Resume: render missing frames' : 'Retry failed frames'}
        </Button>
      ) : null}
      {retry.data ? <span className="text-sm text-teal-300" role="status">{retry.data.requeued} frame{retry.data.requeued === 1 ? '' : 's'} queued again; finished frames are kept.</span> : null}
      {problem ? <Alert tone="error" testId="render-action-error">{problem}</Alert> : null}
    </div>
  );
}

/** A render's live progress, its frames, the per-frame readout chart and the photosensitivity result. */
export function RenderDetailView({ studio, renderId, canManage }: { studio: string; renderId: string; canManage: boolean }) {
  const query = useRenderDetail(studio, renderId);
  if (query.isPending) return <p className="text-sm text-slate-400">Loading render…</p>;
  if (query.isError) return <Alert tone="error" testId="render-error">{query.error.message}</Alert>;
  const detail = query.data;
  const r = detail.render;
  const last = r.frameStart + r.frameCount - 1;
  return (
    <div className="max-w-6xl space-y-6" data-testid="render-detail" data-render-id={r.id}>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="space-y-1">
          <p className="text-sm"><Link href={`/studios/${studio}/renders`} className="text-slate-400 hover:text-teal-300 hover:underline">Renders</Link></p>
          <h1 className="text-2xl font-semibold">
            {r.sceneName} <span className="text-slate-500">· revision {r.revision}</span>
          </h1>
          <p className="text-sm text-slate-400">
            <span className="capitalize">{r.kind}</span> · {r.kind === 'still' ? `frame ${r.frameStart}` : `frames ${r.frameStart}–${last}`} · {r.settings.width}×{r.settings.height} · {formatLabel(r.settings.format)}
            {r.settings.supersampling > 1 ? ` · ${r.settings.supersampling}×${r.settings.supersampling} supersampling` : ''} · requested {formatWhen(r.createdAt)}
          </p>
        </div>
        <RenderStatusBadge status={r.status} testId="render-status" />
      </div>

      {r.draft ? (
        <Alert tone="caution" testId="draft-notice">
          Draft — revision not approved. An advisor has not approved revision {r.revision} of this scene; its frames and delivery are marked as a draft.
        </Alert>
      ) : null}

      <Panel title="Progress" actions={<Actions studio={studio} detail={detail} canManage={canManage} />}>
        <div className="space-y-4">
          <RenderProgress size="lg" done={r.framesDone} failed={r.framesFailed} total={r.frameCount} label="Render progress" testId="render-progress" />
          <dl className="grid gap-3 sm:grid-cols-4">
            <Stat label="Frames per minute" value={detail.framesPerMinute === null ? '–' : formatNumber(detail.framesPerMinute, 3)} testId="frames-per-minute" />
            <Stat label="Time left" value={detail.secondsLeft === null ? (isActive(r.status) ? 'estimating…' : '–') : formatSecondsLeft(detail.secondsLeft)} testId="time-left" />
            <Stat label="Mean time per frame" value={detail.meanRenderMs === null ? '–' : `${(detail.meanRenderMs / 1000).toFixed(1)} s`} testId="mean-render-time" />
            <Stat label="Finished" value={r.finishedAt ? formatWhen(r.finishedAt) : '–'} testId="finished-at" />
          </dl>
          {r.error ? <Alert tone="error" testId="render-last-error">Last error: {r.error}</Alert> : null}
          {detail.delivery ? (
            <p className="text-sm text-slate-300">
              Delivery ready:{' '}
              <Link href={`/studios/${studio}/deliveries/${detail.delivery.id}`} className="text-teal-300 hover:underline" data-testid="delivery-link">open the frame package</Link>
              <span className="text-slate-500"> ({detail.delivery.status})</span>
            </p>
          ) : null}
        </div>
      </Panel>

      <Panel title={`Frames (${detail.frames.length} of ${r.frameCount})`}>
        <FrameGrid studio={studio} renderId={r.id} frames={detail.frames} />
      </Panel>

      {detail.frames.length > 1 ? (
        <Panel title="Shift range and radius per frame">
          <FrameReadoutChart frames={detail.frames} />
        </Panel>
      ) : null}

      <Panel title="Photosensitivity">
        {r.kind === 'still' ? (
          <PhotosensitivityResultView result={r.photosensitivity ?? { verdict: 'not-applicable', summary: 'A still has no flashes; the check applies to frame sequences.' }} />
        ) : (
          <PhotosensitivityResultView result={r.photosensitivity} pending={r.status === 'done' || isActive(r.status)} />
        )}
      </Panel>
    </div>
  );
}

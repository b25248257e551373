'use client';

import Link from 'next/link';
import { useCallback, useDeferredValue, useEffect, useMemo, useState } from 'react';
import type { SceneSpec } from '@/lib/scenes/schema';
import { readoutAt, sceneWorldline } from '@/lib/scenes/readout';
import { properTimeAtScreen, sceneTiming } from '@/lib/scenes/frame-request';
import { screenTimeAt } from '@/lib/scenes/pacing';
import { massScale } from '@/lib/relativity';
import { Panel } from '@/components/ui/panel';
import { Button } from '@/components/ui/button';
import { Scrubber } from '@/components/scenes/timeline/scrubber';
import { ReadoutPanel } from '@/components/scenes/readouts/readout-panel';
import { OrbitBandChart } from '@/components/scenes/charts/orbit-band-chart';
import { useTimeline } from '@/components/scenes/analysis/use-timeline';
import { formatDuration, formatScreenTime } from '@/components/scenes/editor/format';
import { DecisionPanel } from './decision-panel';
import { DiffList } from './diff-list';
import { FrameView, type FramePoint } from './frame-view';
import { frameUrl, reviewFrameSize } from './frame-url';
import { NoteThreads } from './note-threads';
import { StateBadge } from './state-badge';
import { useReview } from './use-review';
import type { ReviewDetail, ReviewNoteView } from './types';

/** How long the scrubber must rest before the server renders the frame there, ms. */
const FRAME_REST_MS = 250;

/**
 * The review of one revision: scrub the path (screen time, with the proper
 * time and readouts there), see the server-rendered frame, pin notes to the
 * moment (and a point on the frame), reply, resolve, and decide.
 */
export function ReviewWorkspace({ studio, reviewId, spec, initial, role }: { studio: string; reviewId: string; spec: SceneSpec; initial: ReviewDetail; role: string }) {
  const { detail, addNote, setStatus, approve, requestChanges } = useReview(studio, reviewId, initial);
  const { review } = detail;
  const isAdvisor = role === 'advisor';
  const open = review.state === 'in_review';

  const worldline = useMemo(() => sceneWorldline(spec), [spec]);
  const timing = useMemo(() => sceneTiming(spec, worldline), [spec, worldline]);
  const secondsPerM = massScale(spec.massSolar).secondsPerM;
  const [screenTime, setScreenTime] = useState(timing.screenStartS);
  const [scrubbing, setScrubbing] = useState(false);
  const tau = useMemo(() => properTimeAtScreen(timing, worldline, screenTime), [timing, worldline, screenTime]);
  const readoutTau = useDeferredValue(tau);
  const readout = useMemo(() => readoutAt(spec, worldline, readoutTau), [spec, worldline, readoutTau]);
  const [frameTau, setFrameTau] = useState(tau);
  useEffect(() => {
    if (scrubbing) return;
    const timer = setTimeout(() => setFrameTau(tau), FRAME_REST_MS);
    return () => clearTimeout(timer);
  }, [scrubbing, tau]);
  const [lensing, setLensing] = useState(true);
  const [point, setPoint] = useState<FramePoint | null>(null);
  const [noteBody, setNoteBody] = useState('');
  const timeline = useTimeline(spec);

  const size = reviewFrameSize(spec.projection.kind, 480);
  const src = frameUrl(studio, review.sceneId, review.revision, frameTau, size, lensing);
  const screenTimeOf = useCallback((t: number) => screenTimeAt(timing.curve, t), [timing]);
  const goTo = useCallback((note: ReviewNoteView) => {
    if (note.tau === null) return;
    setScreenTime(screenTimeAt(timing.curve, note.tau));
    setPoint(note.point);
  }, [timing]);

  const pin = () => {
    if (!noteBody.trim()) return;
    addNote.mutate({ body: noteBody.trim(), tau, ...(point ? { point } : {}) }, { onSuccess: () => { setNoteBody(''); setPoint(null); } });
  };

  return (
    <div className="space-y-6" data-testid="review-page" data-review-state={review.state}>
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold" data-testid="review-title">{review.sceneName} · revision {review.revision}</h1>
        <StateBadge state={review.state} testId="review-state" />
        <Link href={`/studios/${studio}/reviews/${reviewId}/report`} className="ml-auto rounded-md border border-teal-500/60 px-3 py-1.5 text-sm text-teal-300 hover:bg-teal-500/10" data-testid="report-link">
          Accuracy report
        </Link>
      </header>
      {review.message ? <p className="text-sm text-slate-300">Producer&apos;s note: <span className="whitespace-pre-wrap">{review.message}</span></p> : null}
      <p className="text-xs text-slate-500">Content hash <code className="font-mono">{review.contentHash.slice(0, 16)}</code> · an approval binds to exactly this content.</p>

      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <Panel title="Scrub the path" actions={
          <label className="flex items-center gap-2 text-xs text-slate-300">
            <input type="checkbox" className="accent-teal-400" checked={lensing} onChange={(e) => setLensing(e.target.checked)} data-testid="lensing-toggle" />
            bending of light
          </label>
        }>
          <div className="space-y-4">
            <div className="mx-auto max-w-2xl">
              <FrameView src={src} alt={`Frame at ${formatScreenTime(screenTimeOf(frameTau))} screen time${lensing ? '' : ', bending of light off'}`} width={size.width} height={size.height} point={point} onPick={isAdvisor && open ? setPoint : undefined} testId="frame-image" />
              <p className="mt-1 text-xs text-slate-500">
                {isAdvisor && open ? 'Click the frame to mark a point for your note. ' : ''}
                Rendered on the server by the same engine as final frames, {size.width} × {size.height} px{lensing ? '' : ', with the bending of light switched off for comparison'}.
              </p>
            </div>
            <Scrubber start={timing.screenStartS} end={timing.screenEndS} value={screenTime} tauSeconds={tau * secondsPerM} onChange={setScreenTime} onScrubbing={setScrubbing} />
            <NoteTicks notes={detail.notes} start={timing.screenStartS} end={timing.screenEndS} screenTimeOf={screenTimeOf} onGoTo={goTo} />
            {timeline.points ? <OrbitBandChart points={timeline.points} screenTime={screenTime} radiusRs={readout.radiusRs} onPick={setScreenTime} /> : <p className="text-xs text-slate-500">{timeline.error ?? 'Sampling the path for the chart…'}</p>}
          </div>
        </Panel>
        <Panel title="Readouts here">
          <ReadoutPanel readout={readout} stale={readoutTau !== tau} />
        </Panel>
      </div>

      <div className="grid gap-6 xl:grid-cols-2">
        <Panel title="Notes" testId="notes-panel">
          <div className="space-y-4">
            {isAdvisor && open ? (
              <div className="space-y-2 rounded-md border border-violet-500/30 bg-violet-500/5 p-3">
                <label htmlFor="pin-note-body" className="block text-sm font-medium text-slate-200">
                  Note at {formatScreenTime(screenTime)} screen time ({formatDuration(tau * secondsPerM)} proper time){point ? `, at the marked point` : ''}
                </label>
                <textarea id="pin-note-body" rows={3} maxLength={5000} value={noteBody} onChange={(e) => setNoteBody(e.target.value)} data-testid="pin-note-body" placeholder="What is wrong or unclear at this moment?" className="w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400" />
                <div className="flex items-center gap-2">
                  <Button onClick={pin} disabled={addNote.isPending || !noteBody.trim()} data-testid="pin-note">Pin note here</Button>
                  {point ? <Button variant="secondary" onClick={() => setPoint(null)} data-testid="clear-point">Clear point</Button> : null}
                </div>
              </div>
            ) : null}
            <NoteThreads
              notes={detail.notes}
              open={open}
              canReply
              canSetStatus={isAdvisor}
              screenTimeOf={screenTimeOf}
              secondsPerM={secondsPerM}
              onGoTo={goTo}
              onReply={(parentId, body) => addNote.mutateAsync({ body, parentId })}
              onStatus={(noteId, status) => setStatus.mutate({ noteId, status })}
              busy={addNote.isPending || setStatus.isPending}
              error={(addNote.error ?? setStatus.error)?.message ?? null}
            />
          </div>
        </Panel>
        <div className="space-y-6">
          <Panel title="Decision">
            <DecisionPanel
              detail={detail}
              canDecide={isAdvisor}
              onApprove={() => approve.mutate()}
              onRequestChanges={(message) => requestChanges.mutate(message)}
              busy={approve.isPending || requestChanges.isPending}
              error={(approve.error ?? requestChanges.error)?.message ?? null}
            />
          </Panel>
          <Panel title="Changes since the last approved revision">
            <DiffList diff={detail.diffFromApproved} />
          </Panel>
        </div>
      </div>
    </div>
  );
}

/** Where the notes sit along the shot, under the scrubber; click one to go there. */
function NoteTicks({ notes, start, end, screenTimeOf, onGoTo }: { notes: ReviewNoteView[]; start: number; end: number; screenTimeOf: (tau: number) => number; onGoTo: (note: ReviewNoteView) => void }) {
  const pinned = notes.filter((n) => n.parentId === null && n.tau !== null);
  if (!pinned.length) return null;
  const span = Math.max(end - start, 1e-9);
  return (
    <div className="relative mx-[4.75rem] mr-[10.75rem] h-4" aria-label="Notes along the shot">
      {pinned.map((n) => (
        <button
          key={n.id}
          type="button"
          title={n.body}
          onClick={() => onGoTo(n)}
          className={`absolute top-0 h-4 w-2 -translate-x-1/2 rounded-sm ${n.status === 'open' ? 'bg-violet-400' : 'bg-slate-500'}`}
          style={{ left: `${((screenTimeOf(n.tau!) - start) / span) * 100}%` }}
          data-testid="note-tick"
        />
      ))}
    </div>
  );
}

'use client';

import { memo, useCallback, useDeferredValue, useMemo, useState, type ReactNode } from 'react';
import { readoutAt } from '@/lib/scenes/readout';
import { properTimeAtScreen } from '@/lib/scenes/frame-request';
import { PlayheadContext, type PlayheadValue } from './editor-context';
import type { LiveScene } from './use-live-scene';
import { ReadoutPanel } from '../readouts/readout-panel';
import { Scrubber } from '../timeline/scrubber';
import { ChartsColumn } from '../charts/charts-column';
import { ScenePreview } from '../preview/scene-preview';

// re-rendered only when their deferred inputs change, not on every frame of a scrub
const DeferredReadouts = memo(ReadoutPanel);
const DeferredCharts = memo(ChartsColumn);

/**
 * The part of the editor that moves with the scrubber: preview, scrubber,
 * readouts and charts. It owns the scrub position, so a scrub or playback
 * re-renders only this component and the playhead's consumers; the form
 * panels arrive as elements made by the parent and are not re-rendered.
 * The preview gets the exact position; readouts, charts and markers follow a
 * deferred copy that React renders when a frame leaves time for it.
 */
export function EditorWorkspace({
  live,
  valid,
  secondsPerM,
  pacing,
  tabs,
}: {
  live: LiveScene | null;
  valid: boolean | undefined;
  secondsPerM: number | null;
  pacing: ReactNode;
  tabs: ReactNode;
}) {
  const [screenTime, setScreenTimeRaw] = useState(0);
  const [scrubbing, setScrubbing] = useState(false);
  const timing = live?.timing;
  const setScreenTime = useCallback((s: number) => setScreenTimeRaw(Number.isFinite(s) ? s : 0), []);
  const clampedScreen = timing ? Math.min(Math.max(screenTime, timing.screenStartS), timing.screenEndS) : 0;
  const tau = live ? properTimeAtScreen(live.timing, live.worldline, clampedScreen) : 0;
  const deferredScreen = useDeferredValue(clampedScreen);
  const deferredTau = live ? properTimeAtScreen(live.timing, live.worldline, deferredScreen) : 0;
  const readout = useMemo(() => (live ? readoutAt(live.spec, live.worldline, deferredTau) : null), [live, deferredTau]);
  const playhead: PlayheadValue = useMemo(() => ({ tau: deferredTau, screenTime: deferredScreen, setScreenTime }), [deferredTau, deferredScreen, setScreenTime]);

  return (
    <PlayheadContext.Provider value={playhead}>
      <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_18rem]">
        <section className="min-w-0 space-y-3 rounded-lg border border-ink-700 bg-ink-800/80 p-4" aria-label="Preview">
          <ScenePreview live={live} tau={tau} scrubbing={scrubbing} stale={valid === false} />
          {timing ? (
            <Scrubber start={timing.screenStartS} end={timing.screenEndS} value={clampedScreen} tauSeconds={secondsPerM ? tau * secondsPerM : null} onChange={setScreenTime} onScrubbing={setScrubbing} />
          ) : null}
          {pacing}
        </section>
        <section className="rounded-lg border border-ink-700 bg-ink-800/80 p-4" aria-label="Readouts">
          <h2 className="mb-2 text-sm font-semibold text-slate-200">Readouts</h2>
          <DeferredReadouts readout={readout} stale={valid === false || deferredTau !== tau} />
        </section>
      </div>

      <div className="grid gap-4 xl:grid-cols-2">
        {tabs}
        <DeferredCharts screenTime={deferredScreen} readout={readout} />
      </div>
    </PlayheadContext.Provider>
  );
}

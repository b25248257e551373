'use client';

import type { SceneReadout } from '@/lib/scenes/readout';
import { DOME_COMFORT_LIMIT_DEG_PER_S } from '@/lib/scenes/look';
import { sampleWorldline } from '@/lib/relativity';
import { Alert } from '@/components/ui/alert';
import { useEditor, usePlayhead } from '../editor/editor-context';
import { useTimeline } from '../analysis/use-timeline';
import { OrbitBandChart } from './orbit-band-chart';
import { PotentialChart } from './potential-chart';
import { TimeCharts } from './time-charts';

/** The charts beside the panels: the whole descent as pictures; click any chart to scrub there. */
export function ChartsColumn({ screenTime, readout }: { screenTime: number; readout: SceneReadout | null }) {
  const { live } = useEditor();
  const { tau, setScreenTime } = usePlayhead();
  const timeline = useTimeline(live?.spec ?? null);
  const points = timeline.points;
  const sample = live ? sampleWorldline(live.worldline, Math.min(tau, live.worldline.duration)) : null;
  const maxRadiusM = points ? Math.max(...points.map((p) => p.radiusRs * 2)) : (sample?.state.r ?? 20);
  const fastest = points ? points.reduce((m, p) => Math.max(m, p.lookTurnDegPerS), 0) : 0;
  return (
    <section className="space-y-4 rounded-lg border border-ink-700 bg-ink-800/80 p-4" aria-label="Charts" data-testid="charts">
      {timeline.error ? <Alert tone="error">{timeline.error}</Alert> : null}
      {fastest > DOME_COMFORT_LIMIT_DEG_PER_S ? (
        <Alert tone="caution" testId="comfort-warning">
          Dome motion comfort: the view turns at up to {fastest.toFixed(0)}°/s against the stars, above the {DOME_COMFORT_LIMIT_DEG_PER_S}°/s limit used here (common practice, no
          single source; your venue&apos;s guidance decides). Spread the turn over more screen time or slow the pacing there.
        </Alert>
      ) : null}
      {points ? <OrbitBandChart points={points} screenTime={screenTime} radiusRs={readout?.radiusRs ?? null} onPick={setScreenTime} /> : <p className="text-sm text-slate-400">Sampling the shot…</p>}
      {sample ? (
        <PotentialChart radiusM={sample.state.r} energy={sample.state.energy} angularMomentum={sample.state.angularMomentum} maxRadiusM={maxRadiusM} hovering={sample.kind === 'hover' || sample.kind === 'hold'} />
      ) : null}
      {points ? <TimeCharts points={points} screenTime={screenTime} onPick={setScreenTime} /> : null}
    </section>
  );
}

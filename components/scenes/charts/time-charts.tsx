'use client';

import { memo, type CSSProperties, type ReactNode } from 'react';
import { Area, CartesianGrid, ComposedChart, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ILLUSTRATIVE_DISRUPTION_THRESHOLD_G } from '@/lib/scenes/readout';
import { DOME_COMFORT_LIMIT_DEG_PER_S } from '@/lib/scenes/look';
import type { TimelinePoint } from '../analysis/timeline';
import { formatDuration } from '../editor/format';
import { AXIS, GRID, TEAL, VIOLET, decadeTicks, logTick, positive } from './chart-theme';
import { pick } from './orbit-band-chart';
import { ChartCursor, linearFraction, screenSpan } from './chart-cursor';

/** Plot-area insets of the small charts: margins (top 6, right 10), y-axis 48 px, x-axis 30 px. */
const SMALL_CHART_INSETS = { left: 48, right: 10, top: 6, bottom: 30 };

function SmallChart({ title, testId, children, note }: { title: string; testId: string; children: ReactNode; note?: ReactNode }) {
  return (
    <figure className="space-y-1" data-testid={testId}>
      <figcaption className="text-xs font-medium text-slate-300">{title}</figcaption>
      <div className="relative h-36 [contain:strict]">
        {children}
        <ChartCursor insets={SMALL_CHART_INSETS} x="inherit" />
      </div>
      {note ? <p className="text-[11px] text-slate-500">{note}</p> : null}
    </figure>
  );
}

function logDomain(values: (number | null)[], pad = 2): [number, number] {
  const v = values.filter((x): x is number => x !== null && x > 0);
  if (v.length === 0) return [1e-3, 1];
  return [Math.min(...v) / pad, Math.max(...v) * pad];
}

const tooltip = { contentStyle: { background: '#0a0e17', border: '1px solid #3b4659', fontSize: 12 }, labelFormatter: (v: unknown) => `screen ${Number(v).toFixed(1)} s` };

/** Countdown, tidal stretch, shift range and look turn rate against screen time: the descent as pictures. */
export function TimeCharts({ points, screenTime, onPick }: { points: TimelinePoint[]; screenTime: number; onPick: (screenTime: number) => void }) {
  const [start, end] = screenSpan(points);
  // the cursor moves through a CSS variable; the charts re-render only when the path changes
  return (
    <div style={{ '--chart-cursor-x': linearFraction(screenTime, start, end) } as CSSProperties}>
      <TimeChartPlots points={points} onPick={onPick} />
    </div>
  );
}

const TimeChartPlots = memo(function TimeChartPlots({ points, onPick }: { points: TimelinePoint[]; onPick: (screenTime: number) => void }) {
  const [start, end] = screenSpan(points);
  const x = { dataKey: 'screenTime', type: 'number' as const, domain: [start, end], ...AXIS, tickFormatter: (v: number) => `${Math.round(v)} s` };
  const data = points.map((p) => ({
    screenTime: p.screenTime,
    countdown: positive(p.countdownSeconds),
    stretch: positive(p.stretchG, 1e-15),
    shift: p.shiftMin !== null && p.shiftMax !== null ? [Math.max(p.shiftMin, 1e-6), Math.max(p.shiftMax, 1e-6)] : null,
    turn: p.lookTurnDegPerS,
  }));
  const reachesSingularity = points.some((p) => p.countdownSeconds !== null);
  const countdownDomain = logDomain(data.map((d) => d.countdown));
  const stretchDomain = logDomain([...data.map((d) => d.stretch), ILLUSTRATIVE_DISRUPTION_THRESHOLD_G]);
  const shiftDomain = logDomain(points.flatMap((p) => [p.shiftMin, p.shiftMax]), 1.5);
  const turnMax = Math.max(DOME_COMFORT_LIMIT_DEG_PER_S * 1.3, ...points.map((p) => p.lookTurnDegPerS * 1.1));
  const click = (state: unknown) => pick(state, points, onPick);
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <SmallChart title="Countdown: proper time left to the singularity" testId="countdown-chart" note={reachesSingularity ? undefined : 'This path does not reach the singularity.'}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 6, right: 10, bottom: 0, left: 0 }} onClick={click}>
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis {...x} />
            <YAxis scale="log" domain={countdownDomain} ticks={decadeTicks(...countdownDomain)} allowDataOverflow {...AXIS} width={48} tickFormatter={(v: number) => formatDuration(v)} />
            <Tooltip {...tooltip} formatter={(v) => [formatDuration(Number(v)), 'left']} />
            <Line dataKey="countdown" stroke={TEAL} strokeWidth={2} dot={false} isAnimationActive={false} connectNulls={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </SmallChart>
      <SmallChart title="Tidal stretch across a 2 m body" testId="stretch-chart" note={`Dashed line: ${ILLUSTRATIVE_DISRUPTION_THRESHOLD_G} g, an illustrative disruption threshold (an assumption, not a measured limit).`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 6, right: 10, bottom: 0, left: 0 }} onClick={click}>
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis {...x} />
            <YAxis scale="log" domain={stretchDomain} ticks={decadeTicks(...stretchDomain)} allowDataOverflow {...AXIS} width={48} tickFormatter={(v: number) => `${logTick(v)} g`} />
            <Tooltip {...tooltip} formatter={(v) => [`${Number(v).toPrecision(3)} g`, 'stretch']} />
            <ReferenceLine y={ILLUSTRATIVE_DISRUPTION_THRESHOLD_G} stroke={VIOLET} strokeDasharray="5 4" ifOverflow="hidden" />
            <Line dataKey="stretch" stroke={TEAL} strokeWidth={2} dot={false} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </SmallChart>
      <SmallChart title="Frequency shift across the frame (lowest to highest, 1 = unshifted)" testId="shift-chart">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 6, right: 10, bottom: 0, left: 0 }} onClick={click}>
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis {...x} />
            <YAxis scale="log" domain={shiftDomain} allowDataOverflow {...AXIS} width={48} tickFormatter={logTick} />
            <Tooltip {...tooltip} formatter={(v) => [Array.isArray(v) ? `${Number(v[0]).toPrecision(3)} – ${Number(v[1]).toPrecision(3)}` : String(v), 'shift g']} />
            <ReferenceLine y={1} stroke="#5b6880" strokeDasharray="3 3" />
            <Area dataKey="shift" stroke={VIOLET} fill={VIOLET} fillOpacity={0.35} isAnimationActive={false} connectNulls={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </SmallChart>
      <SmallChart title="How fast the view turns against the stars" testId="turn-chart" note={`Dashed line: ${DOME_COMFORT_LIMIT_DEG_PER_S}°/s dome comfort limit (common practice, no single source; follow your venue).`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 6, right: 10, bottom: 0, left: 0 }} onClick={click}>
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis {...x} />
            <YAxis domain={[0, turnMax]} allowDataOverflow {...AXIS} width={48} tickFormatter={(v: number) => `${Math.round(v)}°/s`} />
            <Tooltip {...tooltip} formatter={(v) => [`${Number(v).toFixed(1)}°/s`, 'turn rate']} />
            <ReferenceLine y={DOME_COMFORT_LIMIT_DEG_PER_S} stroke={VIOLET} strokeDasharray="5 4" />
            <Line dataKey="turn" stroke={TEAL} strokeWidth={2} dot={false} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </SmallChart>
    </div>
  );
});

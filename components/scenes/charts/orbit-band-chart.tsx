'use client';

import { memo, useMemo } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { TimelinePoint } from '../analysis/timeline';
import { AXIS, BAND_COLOURS, BAND_LIMITS_RS, GRID, LINE, decadeTicks, logTick } from './chart-theme';
import { ChartCursor, WIDE_CHART_INSETS, linearFraction, logFraction, screenSpan } from './chart-cursor';

/** Radius axis of the chart: log scale from below the horizon to above the path's highest point, r_s. */
function radiusDomain(points: TimelinePoint[]): [number, number] {
  const radii = points.map((p) => p.radiusRs).filter((r) => r > 0);
  return [Math.min(0.3, ...radii.map((r) => r * 0.7)), Math.max(4.5, ...radii.map((r) => r * 1.4))];
}

/**
 * The path over the orbit bands: radius (r_s, log scale) against screen time,
 * on bands coloured teal -> blue -> indigo -> near-black, with the current moment marked.
 */
export function OrbitBandChart({ points, screenTime, radiusRs, onPick }: { points: TimelinePoint[]; screenTime: number; radiusRs: number | null; onPick: (screenTime: number) => void }) {
  // the axes change with the path, not with the moment, which moves on every frame of a scrub
  const domain = useMemo(() => radiusDomain(points), [points]);
  const [lo, hi] = domain;
  const [start, end] = screenSpan(points);
  return (
    <figure className="space-y-1" data-testid="orbit-band-chart">
      <figcaption className="text-xs font-medium text-slate-300">Where the camera is: radius against screen time, over the orbit bands</figcaption>
      <div className="relative h-56 [contain:strict]">
        <OrbitBandPlot points={points} domain={domain} onPick={onPick} />
        <ChartCursor insets={WIDE_CHART_INSETS} x={linearFraction(screenTime, start, end)} y={radiusRs !== null ? logFraction(Math.max(radiusRs, lo), lo, hi) : null} />
      </div>
    </figure>
  );
}

/** The chart itself, re-rendered only when the path changes. */
const OrbitBandPlot = memo(function OrbitBandPlot({ points, domain, onPick }: { points: TimelinePoint[]; domain: [number, number]; onPick: (screenTime: number) => void }) {
  const [lo, hi] = domain;
  const [start, end] = screenSpan(points);
  const bands = [
    { name: 'stable orbits' as const, y1: BAND_LIMITS_RS.isco, y2: hi },
    { name: 'unstable orbits' as const, y1: BAND_LIMITS_RS.photonSphere, y2: BAND_LIMITS_RS.isco },
    { name: 'no orbits' as const, y1: BAND_LIMITS_RS.horizon, y2: BAND_LIMITS_RS.photonSphere },
    { name: 'interior' as const, y1: lo, y2: BAND_LIMITS_RS.horizon },
  ];
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={points} margin={{ top: 6, right: 12, bottom: 4, left: 0 }} onClick={(state) => pick(state, points, onPick)}>
        {bands.map((b) => (
          <ReferenceArea
            key={b.name}
            x1={start}
            x2={end}
            y1={b.y1}
            y2={b.y2}
            fill={BAND_COLOURS[b.name]}
            fillOpacity={b.name === 'interior' ? 0.9 : 0.35}
            stroke="none"
            ifOverflow="hidden"
            label={{ value: b.name, position: 'insideTopLeft', fill: '#d6dce6', fontSize: 11 }}
          />
        ))}
        <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
        <XAxis dataKey="screenTime" type="number" domain={[start, end]} {...AXIS} tickFormatter={(v: number) => `${Math.round(v)} s`} />
        <YAxis scale="log" domain={[lo, hi]} ticks={[...decadeTicks(lo, hi), 1, 1.5, 3].sort((a, b) => a - b)} allowDataOverflow {...AXIS} width={44} tickFormatter={logTick} label={{ value: 'r_s', angle: -90, position: 'insideLeft', fill: '#8592a8', fontSize: 11 }} />
        <Tooltip contentStyle={{ background: '#0a0e17', border: '1px solid #3b4659', fontSize: 12 }} labelFormatter={(v) => `screen ${Number(v).toFixed(1)} s`} formatter={(v) => [`${Number(v).toPrecision(4)} r_s`, 'radius']} />
        <Line dataKey="radiusRs" stroke={LINE} strokeWidth={2} dot={false} isAnimationActive={false} />
      </LineChart>
    </ResponsiveContainer>
  );
});

/** Chart click -> the screen time of the nearest sample. */
export function pick(state: unknown, points: TimelinePoint[], onPick: (screenTime: number) => void): void {
  const index = Number((state as { activeTooltipIndex?: number | string | null } | null)?.activeTooltipIndex);
  if (Number.isInteger(index) && points[index]) onPick(points[index].screenTime);
}

'use client';

import { memo, useMemo } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { AXIS, BAND_COLOURS, BAND_LIMITS_RS, CURSOR, GRID, TEAL, logTick } from './chart-theme';
import { ChartCursor, WIDE_CHART_INSETS, linearFraction, logFraction } from './chart-cursor';

const LO_RS = 0.9;

/**
 * Effective potential V(r) = (1 - 2M/r)(1 + L^2/r^2) for the path's angular
 * momentum L (physics.md section 3: (u^r)^2 = E^2 - V), with the energy level E^2
 * and the camera's radius: where the energy line is below the curve the camera cannot go.
 */
export function effectivePotential(rM: number, angularMomentum: number): number {
  return (1 - 2 / rM) * (1 + (angularMomentum * angularMomentum) / (rM * rM));
}

export function PotentialChart({ radiusM, energy, angularMomentum, maxRadiusM, hovering }: { radiusM: number; energy: number; angularMomentum: number; maxRadiusM: number; hovering: boolean }) {
  const hiRs = Math.max(6, (maxRadiusM / 2) * 1.3);
  const e2 = energy * energy;
  const curve = useMemo(() => potentialCurve(hiRs, angularMomentum), [hiRs, angularMomentum]);
  const { yLo, yHi } = potentialRange(curve, e2);
  return (
    <figure className="space-y-1" data-testid="potential-chart">
      <figcaption className="text-xs font-medium text-slate-300">
        Effective potential for this moment&apos;s angular momentum ({angularMomentum.toFixed(2)} GM/c){hovering ? '; rockets hold the camera off the curve' : ''}
      </figcaption>
      <div className="relative h-48 [contain:strict]">
        <PotentialPlot data={curve} hiRs={hiRs} e2={e2} yLo={yLo} yHi={yHi} />
        <ChartCursor insets={WIDE_CHART_INSETS} line={false} x={logFraction(Math.max(radiusM / 2, LO_RS), LO_RS, hiRs)} y={linearFraction(Math.min(Math.max(e2, yLo), yHi), yLo, yHi)} />
      </div>
    </figure>
  );
}

/** V(r) sampled on a log grid from 0.9 r_s to hiRs, and the chart's vertical range for it and the energy level. */
function potentialCurve(hiRs: number, angularMomentum: number): { rRs: number; v: number }[] {
  const out: { rRs: number; v: number }[] = [];
  for (let i = 0; i <= 200; i++) {
    const rRs = LO_RS * Math.pow(hiRs / LO_RS, i / 200);
    out.push({ rRs, v: effectivePotential(rRs * 2, angularMomentum) });
  }
  return out;
}

function potentialRange(data: { rRs: number; v: number }[], e2: number): { yLo: number; yHi: number } {
  const vMax = Math.max(...data.map((d) => d.v));
  return { yHi: Math.max(1.1, Math.min(vMax, 3) * 1.1, e2 * 1.1), yLo: Math.min(0, ...data.map((d) => d.v).filter((v) => v > -1)) };
}

/** The chart itself, re-rendered only when the curve, the energy or the ranges change. */
const PotentialPlot = memo(function PotentialPlot({ data, hiRs, e2, yLo, yHi }: { data: { rRs: number; v: number }[]; hiRs: number; e2: number; yLo: number; yHi: number }) {
  const loRs = LO_RS;
  const bands = [
    { name: 'interior' as const, x1: loRs, x2: BAND_LIMITS_RS.horizon },
    { name: 'no orbits' as const, x1: BAND_LIMITS_RS.horizon, x2: BAND_LIMITS_RS.photonSphere },
    { name: 'unstable orbits' as const, x1: BAND_LIMITS_RS.photonSphere, x2: BAND_LIMITS_RS.isco },
    { name: 'stable orbits' as const, x1: BAND_LIMITS_RS.isco, x2: hiRs },
  ];
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={data} margin={{ top: 6, right: 12, bottom: 4, left: 0 }}>
        {bands.map((b) => <ReferenceArea key={b.name} x1={b.x1} x2={b.x2} y1={yLo} y2={yHi} fill={BAND_COLOURS[b.name]} fillOpacity={0.25} stroke="none" ifOverflow="hidden" />)}
        <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
        <XAxis dataKey="rRs" type="number" scale="log" domain={[loRs, hiRs]} allowDataOverflow {...AXIS} tickFormatter={logTick} ticks={[1, 1.5, 3, 10, 30, 100].filter((t) => t <= hiRs)} label={{ value: 'r_s', position: 'insideBottomRight', fill: '#8592a8', fontSize: 11 }} />
        <YAxis domain={[yLo, yHi]} allowDataOverflow {...AXIS} width={44} tickFormatter={(v: number) => v.toFixed(1)} />
        <Line dataKey="v" stroke={TEAL} strokeWidth={2} dot={false} isAnimationActive={false} />
        <ReferenceLine y={e2} stroke={CURSOR} strokeDasharray="4 3" ifOverflow="hidden" label={{ value: 'energy²', position: 'insideTopRight', fill: CURSOR, fontSize: 11 }} />
      </LineChart>
    </ResponsiveContainer>
  );
});

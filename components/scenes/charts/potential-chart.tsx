'use client';

import { useMemo } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceDot, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { AXIS, BAND_COLOURS, BAND_LIMITS_RS, CURSOR, GRID, TEAL, logTick } from './chart-theme';

/**
 * Effective potential V(r) = (1 - 2M/r)(1 + L^2/r^2) for the path's angular
 * momentum L (physics.md section 3: (u^r)^2 = E^2 - V), with the energy level E^2
 * and the camera's radius: where the energy line is below the curve the camera cannot go.
 */
export function effectivePotential(rM: number, angularMomentum: number): number {
  return (1 - 2 / rM) * (1 + (angularMomentum * angularMomentum) / (rM * rM));
}

export function PotentialChart({ radiusM, energy, angularMomentum, maxRadiusM, hovering }: { radiusM: number; energy: number; angularMomentum: number; maxRadiusM: number; hovering: boolean }) {
  const loRs = 0.9;
  const hiRs = Math.max(6, (maxRadiusM / 2) * 1.3);
  const data = useMemo(() => {
    const out: { rRs: number; v: number }[] = [];
    for (let i = 0; i <= 200; i++) {
      const rRs = loRs * Math.pow(hiRs / loRs, i / 200);
      out.push({ rRs, v: effectivePotential(rRs * 2, angularMomentum) });
    }
    return out;
  }, [hiRs, angularMomentum]);
  const e2 = energy * energy;
  const vMax = Math.max(...data.map((d) => d.v));
  const yHi = Math.max(1.1, Math.min(vMax, 3) * 1.1, e2 * 1.1);
  const yLo = Math.min(0, ...data.map((d) => d.v).filter((v) => v > -1));
  const bands = [
    { name: 'interior' as const, x1: loRs, x2: BAND_LIMITS_RS.horizon },
    { name: 'no orbits' as const, x1: BAND_LIMITS_RS.horizon, x2: BAND_LIMITS_RS.photonSphere },
    { name: 'unstable orbits' as const, x1: BAND_LIMITS_RS.photonSphere, x2: BAND_LIMITS_RS.isco },
    { name: 'stable orbits' as const, x1: BAND_LIMITS_RS.isco, x2: hiRs },
  ];
  return (
    <figure className="space-y-1" data-testid="potential-chart">
      <figcaption className="text-xs font-medium text-slate-300">
        Effective potential for this moment&apos;s angular momentum ({angularMomentum.toFixed(2)} GM/c){hovering ? '; rockets hold the camera off the curve' : ''}
      </figcaption>
      <div className="h-48">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 6, right: 12, bottom: 4, left: 0 }}>
            {bands.map((b) => <ReferenceArea key={b.name} x1={b.x1} x2={b.x2} y1={yLo} y2={yHi} fill={BAND_COLOURS[b.name]} fillOpacity={0.25} stroke="none" ifOverflow="hidden" />)}
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis dataKey="rRs" type="number" scale="log" domain={[loRs, hiRs]} allowDataOverflow {...AXIS} tickFormatter={logTick} ticks={[1, 1.5, 3, 10, 30, 100].filter((t) => t <= hiRs)} label={{ value: 'r_s', position: 'insideBottomRight', fill: '#8592a8', fontSize: 11 }} />
            <YAxis domain={[yLo, yHi]} allowDataOverflow {...AXIS} width={44} tickFormatter={(v: number) => v.toFixed(1)} />
            <Line dataKey="v" stroke={TEAL} strokeWidth={2} dot={false} isAnimationActive={false} />
            <ReferenceLine y={e2} stroke={CURSOR} strokeDasharray="4 3" ifOverflow="hidden" label={{ value: 'energy²', position: 'insideTopRight', fill: CURSOR, fontSize: 11 }} />
            <ReferenceDot x={Math.max(radiusM / 2, loRs)} y={Math.min(Math.max(e2, yLo), yHi)} r={5} fill={CURSOR} stroke="#05070c" ifOverflow="hidden" />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

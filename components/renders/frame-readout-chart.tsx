'use client';

import { Area, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatNumber } from './format';
import type { StoredFrame } from './types';

// Palette from tailwind.config.ts (product.md, Look): teal band for the shift range, violet line for the radius.
const TEAL = '#36cdb9';
const VIOLET = '#a78bfa';
const AXIS = { stroke: '#5b6880', tick: { fill: '#8592a8', fontSize: 11 } } as const;
const GRID = '#1a2233';

/** A positive floor so a log axis never meets zero. */
const SHIFT_FLOOR = 1e-6;

/**
 * Per-frame shift range (frequency ratio seen/emitted, lowest to highest over
 * the frame, log scale) and the camera's radius in r_s, against frame number.
 */
export function FrameReadoutChart({ frames }: { frames: StoredFrame[] }) {
  const data = frames.map((f) => ({
    index: f.index,
    shift: f.readout.shiftMin !== null && f.readout.shiftMax !== null ? [Math.max(f.readout.shiftMin, SHIFT_FLOOR), Math.max(f.readout.shiftMax, SHIFT_FLOOR)] : null,
    radius: f.readout.radiusRs,
  }));
  const shifts = frames.flatMap((f) => [f.readout.shiftMin, f.readout.shiftMax]).filter((v): v is number => v !== null && v > 0);
  const shiftDomain: [number, number] = shifts.length ? [Math.min(...shifts) / 1.5, Math.max(...shifts) * 1.5] : [0.1, 10];
  return (
    <figure className="space-y-2" data-testid="frame-readout-chart">
      <figcaption className="text-xs text-slate-400">Shift range per frame (teal band, log scale: 1 = no shift, below 1 redder, above 1 bluer) and the camera&apos;s radius (violet, r_s).</figcaption>
      <div className="h-64">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 8, right: 8, bottom: 4, left: 0 }}>
            <CartesianGrid stroke={GRID} strokeDasharray="2 4" />
            <XAxis dataKey="index" type="number" domain={['dataMin', 'dataMax']} allowDecimals={false} {...AXIS} label={{ value: 'frame', position: 'insideBottomRight', offset: -2, fill: '#8592a8', fontSize: 11 }} />
            <YAxis yAxisId="shift" scale="log" domain={shiftDomain} allowDataOverflow {...AXIS} width={52} tickFormatter={(v: number) => formatNumber(v, 2)} />
            <YAxis yAxisId="radius" orientation="right" {...AXIS} width={44} tickFormatter={(v: number) => formatNumber(v, 3)} />
            <Tooltip
              contentStyle={{ background: '#0a0e17', border: '1px solid #3b4659', fontSize: 12 }}
              labelFormatter={(v) => `frame ${v}`}
              formatter={(value, name) => (Array.isArray(value) ? [`${formatNumber(Number(value[0]), 3)} – ${formatNumber(Number(value[1]), 3)}`, name] : [`${formatNumber(Number(value), 4)} r_s`, name])}
            />
            <Legend wrapperStyle={{ fontSize: 12, color: '#b3bdcc' }} />
            <Area yAxisId="shift" dataKey="shift" name="shift range" stroke={TEAL} fill={TEAL} fillOpacity={0.35} isAnimationActive={false} connectNulls={false} />
            <Line yAxisId="radius" dataKey="radius" name="radius (r_s)" stroke={VIOLET} strokeWidth={2} dot={frames.length < 40} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

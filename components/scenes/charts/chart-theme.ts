import type { OrbitBand } from '@/lib/relativity';

/** Orbit-band colours (tailwind.config.ts `band`, product.md: teal -> blue -> indigo -> near-black). */
export const BAND_COLOURS: Record<OrbitBand, string> = {
  'stable orbits': '#2bb3a3',
  'unstable orbits': '#2f6fd0',
  'no orbits': '#3b2f9a',
  interior: '#0d0b1f',
};

/** Band limits in r_s (physics.md section 2: r = 6, 3, 2 M). */
export const BAND_LIMITS_RS = { isco: 3, photonSphere: 1.5, horizon: 1 } as const;

export const AXIS = { stroke: '#5b6880', tick: { fill: '#8592a8', fontSize: 11 } } as const;
export const GRID = '#1a2233';
export const CURSOR = '#c4b5fd';
export const LINE = '#d6dce6';
export const TEAL = '#36cdb9';
export const VIOLET = '#a78bfa';

/** Positive floor for log axes (a zero would vanish from a log scale). */
export const positive = (v: number | null | undefined, floor = 1e-12): number | null => (v === null || v === undefined || !Number.isFinite(v) ? null : Math.max(v, floor));

/** Tick label for log axes: 1e-3 .. 1e4 in plain digits, exponents outside. */
export function logTick(v: number): string {
  if (!(v > 0)) return '';
  if (v >= 1e-3 && v < 1e4) return String(Number(v.toPrecision(2)));
  return v.toExponential(0).replace('e+', 'e');
}

/** Powers of ten spanning [lo, hi], for log-axis ticks. */
export function decadeTicks(lo: number, hi: number, maxTicks = 6): number[] {
  const a = Math.floor(Math.log10(lo));
  const b = Math.ceil(Math.log10(hi));
  const step = Math.max(1, Math.ceil((b - a) / maxTicks));
  const ticks: number[] = [];
  for (let e = a; e <= b; e += step) ticks.push(10 ** e);
  return ticks;
}

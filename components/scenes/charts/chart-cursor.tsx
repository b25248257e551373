'use client';

import { CURSOR } from './chart-theme';

/** Insets of a chart's plot area inside its box, px: margins plus the axis band (recharts' XAxis is 30 px tall). */
export interface PlotInsets {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** Plot-area insets of the wide charts (orbit bands, potential): margins (top 6, right 12), y-axis 44 px, x-axis 30 px. */
export const WIDE_CHART_INSETS: PlotInsets = { left: 44, right: 12, top: 6, bottom: 34 };

/** Screen-time span of a sampled shot, s: the first and last samples' (0..1 when there are none). */
export function screenSpan(points: readonly { screenTime: number }[]): [number, number] {
  return [points[0]?.screenTime ?? 0, points[points.length - 1]?.screenTime ?? 1];
}

/** Position of v between lo and hi on a linear axis, 0..1 (clamped). */
export function linearFraction(v: number, lo: number, hi: number): number {
  return hi > lo && Number.isFinite(v) ? Math.min(Math.max((v - lo) / (hi - lo), 0), 1) : 0;
}

/** Position of v between lo and hi on a log axis, 0..1 (clamped; v <= 0 sits at the bottom). */
export function logFraction(v: number, lo: number, hi: number): number {
  return v > 0 && hi > lo && lo > 0 ? linearFraction(Math.log(v), Math.log(lo), Math.log(hi)) : 0;
}

/**
 * The current moment drawn over a chart as an overlay: a vertical line at
 * fraction x of the plot's width and, when y is given, a dot at fraction y of
 * its height (from the bottom). The chart underneath does not re-render when
 * the moment moves, and the marks move by transform on their own compositing
 * layers, so a scrub or playback repaints none of the chart (repainting the
 * charts' SVG every frame cost more than the lensed preview itself).
 */
export function ChartCursor({ insets, x, y, line = true }: { insets: PlotInsets; x: number | 'inherit'; y?: number | null; line?: boolean }) {
  // 'inherit': the fraction comes from the --chart-cursor-x CSS variable of an ancestor, so a memoized chart
  // group can show a moving cursor without re-rendering
  const fraction = x === 'inherit' ? 'var(--chart-cursor-x, 0)' : String(x);
  // each mark sits in a box the size of the plot area; translating the box by a fraction of its own size
  // moves the mark by that fraction of the plot
  return (
    <div className="pointer-events-none absolute inset-0 overflow-hidden" aria-hidden="true" data-testid="chart-cursor">
      {line ? (
        <div className="absolute" style={{ ...insets, transform: `translateX(calc(${fraction} * 100%))`, willChange: 'transform' }}>
          <div className="absolute inset-y-0 left-0 w-[1.5px] -translate-x-1/2" style={{ background: CURSOR }} />
        </div>
      ) : null}
      {y !== undefined && y !== null ? (
        <div className="absolute" style={{ ...insets, transform: `translate(calc(${fraction} * 100%), calc(${-y} * 100%))`, willChange: 'transform' }}>
          <div className="absolute bottom-0 left-0 h-2.5 w-2.5 -translate-x-1/2 translate-y-1/2 rounded-full border border-[#05070c]" style={{ background: CURSOR }} />
        </div>
      ) : null}
    </div>
  );
}

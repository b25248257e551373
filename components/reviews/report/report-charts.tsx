'use client';

import { OrbitBandChart } from '@/components/scenes/charts/orbit-band-chart';
import { TimeCharts } from '@/components/scenes/charts/time-charts';
import type { TimelinePoint } from '@/components/scenes/analysis/timeline';

const ignore = () => undefined;

/**
 * The scene editor's charts, reused for the report: the path over the orbit
 * bands, countdown, tidal stretch, shift range and turn rate against screen
 * time. The report is a document, so clicks do nothing and no cursor is shown
 * (it sits before the shot's start).
 */
export function ReportCharts({ points }: { points: TimelinePoint[] }) {
  const before = (points[0]?.screenTime ?? 0) - 1;
  return (
    <div className="report-charts space-y-4">
      <OrbitBandChart points={points} screenTime={before} radiusRs={null} onPick={ignore} />
      <TimeCharts points={points} screenTime={before} onPick={ignore} />
    </div>
  );
}

import type { ReactNode } from 'react';
import type { AccuracyReport, KeyMomentReport } from '@/lib/reviews/report';
import { formatDuration, formatNumber, formatScreenTime } from '@/components/scenes/editor/format';
import { BAND_COLOURS } from '@/components/scenes/charts/chart-theme';

const ARCSEC_PER_RAD = (180 / Math.PI) * 3600;

/** A numbered report section; on paper each starts a new page. */
export function ReportSection({ title, lead, children, testId }: { title: string; lead?: ReactNode; children: ReactNode; testId: string }) {
  return (
    <section className="report-section space-y-4 rounded-lg border border-ink-700 bg-ink-800/80 p-5" data-testid={testId}>
      <h2 className="text-lg font-semibold text-slate-100">{title}</h2>
      {lead ? <p className="muted max-w-3xl text-sm text-slate-400">{lead}</p> : null}
      {children}
    </section>
  );
}

const th = 'py-1.5 pr-3 font-medium';
const td = 'py-1.5 pr-3 tabular-nums';

/** The camera path's segments. */
export function SegmentTable({ report }: { report: AccuracyReport }) {
  const s = report.secondsPerM;
  return (
    <table className="w-full text-left text-sm" data-testid="segment-table">
      <thead className="text-xs uppercase tracking-wider text-slate-500">
        <tr><th className={th}>#</th><th className={th}>Motion</th><th className={th}>From → to (r_s)</th><th className={th}>Proper time</th><th className={th}>Screen time</th></tr>
      </thead>
      <tbody>
        {report.segments.map((seg) => (
          <tr key={seg.index} className="border-t border-ink-700">
            <td className={td}>{seg.index + 1}</td>
            <td className="py-1.5 pr-3">{seg.kind}{seg.endsAtSingularity ? ' (ends at the singularity)' : ''}</td>
            <td className={td}>{formatNumber(seg.startRadiusRs, 5)} → {seg.endsAtSingularity ? '0' : formatNumber(seg.endRadiusRs, 5)}</td>
            <td className={td}>{formatDuration(seg.tauStartM * s)} + {formatDuration(seg.durationSeconds)} <span className="muted text-slate-500">({formatNumber(seg.durationM, 5)} M)</span></td>
            <td className={td}>{formatScreenTime(seg.screenStartS)} – {formatScreenTime(seg.screenEndS)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Figure({ label, value, note, testId }: { label: string; value: ReactNode; note?: ReactNode; testId?: string }) {
  return (
    <div className="border-b border-ink-700/70 py-1.5">
      <dt className="muted text-[11px] uppercase tracking-wider text-slate-500">{label}</dt>
      <dd className="text-sm tabular-nums text-slate-100" data-testid={testId}>{value}</dd>
      {note ? <p className="muted text-[11px] text-slate-500">{note}</p> : null}
    </div>
  );
}

/** The numbers an advisor checks at a key moment, and the ray table's audit there. */
export function MomentFigures({ item, massSolar }: { item: KeyMomentReport; massSolar: number }) {
  const { readout, rayTable } = item;
  const audit = rayTable.skipped
    ? rayTable.skipped
    : rayTable.fateMismatches > 0
      ? `${rayTable.fateMismatches} of ${rayTable.compared} look angles disagree on where the light comes from`
      : `worst ${rayTable.worstPhiErrorRad.toExponential(1)} rad (${formatNumber(rayTable.worstPhiErrorRad * ARCSEC_PER_RAD, 2)} arcsec) over ${rayTable.compared} look angles`;
  return (
    <dl data-testid="moment-figures" className="grid gap-x-6 sm:grid-cols-2 lg:grid-cols-4">
      <Figure label="Radius" testId="moment-radius" value={<>{formatNumber(readout.radiusRs, 6)} r_s <span className="muted text-slate-400">· {formatNumber(readout.radiusKm, 5)} km for {formatNumber(massSolar, 3)} M☉</span></>} />
      <Figure label="Orbit band" value={<span className="inline-flex items-center gap-2"><span className="keep-colour inline-block h-3 w-3 rounded-sm border border-slate-500" style={{ background: BAND_COLOURS[readout.orbitBand] }} aria-hidden />{readout.orbitBand}</span>} />
      <Figure label="Speed past a hovering observer" value={readout.speedRelativeToHover === null ? 'none: nothing can hover inside the horizon' : `${formatNumber(readout.speedRelativeToHover, 5)} c`} />
      <Figure label="Shift range across the sky" value={readout.shiftRange ? `${formatNumber(readout.shiftRange.min, 4)} – ${formatNumber(readout.shiftRange.max, 4)}` : 'not computed for this motion'} note="1 = unshifted; below 1 redder and dimmer, above 1 bluer and brighter." />
      <Figure label="Thrust" value={readout.thrustG === 0 ? '0 g (free fall)' : `${formatNumber(readout.thrustG, 4)} g`} />
      <Figure label={`Tides across ${readout.bodyLengthMetres} m`} value={`stretch ${formatNumber(readout.stretchG, 4)} g · squeeze ${formatNumber(readout.squeezeG, 4)} g`} note={`${readout.stretchG >= readout.disruptionThresholdG ? 'Above' : 'Below'} the illustrative ${readout.disruptionThresholdG} g disruption line (an assumption).`} />
      <Figure label="Countdown to the singularity" value={readout.countdownSeconds === null ? 'none: this path does not reach it' : formatDuration(readout.countdownSeconds)} />
      <Figure label="Time seen far away" value={readout.distantTimeSeconds === null ? 'never: a distant observer does not see the camera reach the horizon' : formatDuration(readout.distantTimeSeconds)} note="Since the shot began, on the clock of an observer at rest far from the hole (Schwarzschild time)." />
      <Figure label="Ray table against the exact computation" testId="moment-ray-audit" value={audit} note="Light directions from the renderer's lookup table, compared with the exact calculation; a 1e-6 rad band at the shadow's edge is left out." />
    </dl>
  );
}

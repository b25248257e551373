'use client';

import type { ReactNode } from 'react';
import type { SceneReadout } from '@/lib/scenes/readout';
import { BAND_COLOURS } from '../charts/chart-theme';
import { formatDuration, formatNumber } from '../editor/format';

function Row({ label, children, testId, note }: { label: string; children: ReactNode; testId: string; note?: ReactNode }) {
  return (
    <div className="border-b border-ink-700/70 py-2 last:border-0">
      <dt className="text-[11px] uppercase tracking-wider text-slate-500">{label}</dt>
      <dd className="text-sm tabular-nums text-slate-100" data-testid={testId}>{children}</dd>
      {note ? <p className="text-[11px] text-slate-500">{note}</p> : null}
    </div>
  );
}

/** Physics readouts at the scrubber's moment, in SI for the scene's mass (lib/scenes/readout.ts). */
export function ReadoutPanel({ readout, stale }: { readout: SceneReadout | null; stale: boolean }) {
  if (!readout) return <p className="text-sm text-slate-400">Readouts appear once the scene is valid.</p>;
  const overThreshold = readout.stretchG >= readout.disruptionThresholdG;
  return (
    <dl
      data-testid="readouts"
      data-tau={readout.tau}
      data-countdown-seconds={readout.countdownSeconds ?? ''}
      data-distant-seconds={readout.distantTimeSeconds ?? ''}
      data-orbit-band={readout.orbitBand}
      data-radius-rs={readout.radiusRs}
      className={stale ? 'opacity-60' : undefined}
    >
      <Row label="Radius" testId="readout-radius">
        {formatNumber(readout.radiusRs, 5)} r_s <span className="text-slate-400">· {formatNumber(readout.radiusKm, 4)} km</span>
      </Row>
      <Row label="Orbit band" testId="readout-band">
        <span className="inline-flex items-center gap-2">
          <span className="inline-block h-3 w-3 rounded-sm border border-slate-500" style={{ background: BAND_COLOURS[readout.orbitBand] }} aria-hidden />
          {readout.orbitBand}
        </span>
      </Row>
      <Row label="Countdown to the singularity" testId="readout-countdown" note={readout.countdownSeconds === null ? 'This path does not reach the singularity.' : 'Proper time left on the traveller’s clock.'}>
        {readout.countdownSeconds === null ? 'none' : formatDuration(readout.countdownSeconds)}
      </Row>
      <Row label="Speed past a hovering observer" testId="readout-speed" note={readout.speedRelativeToHover === null ? 'Inside the horizon nothing can hover, so there is no such observer.' : undefined}>
        {readout.speedRelativeToHover === null ? 'no hovering observer' : `${formatNumber(readout.speedRelativeToHover, 4)} c`}
      </Row>
      <Row
        label="Time seen far away"
        testId="readout-distant-time"
        note={readout.distantTimeSeconds === null ? 'A distant observer never sees the camera reach the horizon: no far-away time applies from there on.' : 'Since the shot began, on the clock of an observer at rest far from the hole.'}
      >
        {readout.distantTimeSeconds === null ? 'never (beyond the horizon)' : formatDuration(readout.distantTimeSeconds)}
      </Row>
      <Row label="Shift range across the frame" testId="readout-shift" note="1 = unshifted; below 1 redder, above 1 bluer.">
        {readout.shiftRange ? `${formatNumber(readout.shiftRange.min, 3)} – ${formatNumber(readout.shiftRange.max, 3)}` : 'not computed for this motion'}
      </Row>
      <Row label="Thrust needed" testId="readout-thrust" note={readout.thrustG === 0 ? 'Free fall: the rockets are off.' : undefined}>
        {formatNumber(readout.thrustG, 4)} g
      </Row>
      <Row
        label={`Tides across a ${readout.bodyLengthMetres} m body`}
        testId="readout-tides"
        note={
          <span className={overThreshold ? 'text-violet-300' : undefined}>
            {overThreshold ? 'Above' : 'Below'} the illustrative disruption threshold of {readout.disruptionThresholdG} g (an assumption, not a measured limit).
          </span>
        }
      >
        stretch {formatNumber(readout.stretchG, 3)} g · squeeze {formatNumber(readout.squeezeG, 3)} g
      </Row>
      <Row label="Proper time so far" testId="readout-tau">{formatDuration(readout.tauSeconds)}</Row>
    </dl>
  );
}

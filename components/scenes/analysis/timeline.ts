/**
 * The whole shot at a glance: physics readouts sampled along screen time, for
 * the charts (countdown, tidal stretch, shift range, look turn rate). Pure
 * TypeScript; runs in the analysis worker.
 */
import { sampleWorldline, type OrbitBand, type Worldline } from '@/lib/relativity';
import type { SceneSpec } from '@/lib/scenes/schema';
import { readoutAt } from '@/lib/scenes/readout';
import { angleBetweenDeg, cameraToHoleDirection, lookAt, type Vector3 } from '@/lib/scenes/look';
import { properTimeAtScreen, type SceneTiming } from '@/lib/scenes/frame-request';

export interface TimelinePoint {
  screenTime: number;
  tau: number;
  radiusRs: number;
  band: OrbitBand;
  countdownSeconds: number | null;
  stretchG: number;
  squeezeG: number;
  thrustG: number;
  shiftMin: number | null;
  shiftMax: number | null;
  /** turn rate of the look direction against the distant stars, degrees per screen second */
  lookTurnDegPerS: number;
}

/** The look direction in the hole's fixed frame at proper time tau. */
function lookInHoleFrame(spec: SceneSpec, worldline: Worldline, tau: number): Vector3 {
  const sample = sampleWorldline(worldline, tau);
  const look = lookAt(spec.look.keyframes, tau).look;
  return cameraToHoleDirection([0, 0, 0], look, sample.radialAxis, sample.tangentAxis, sample.normalAxis);
}

/**
 * Readouts at `count` evenly spaced screen times over the shot.
 * @param spec validated scene
 * @param worldline built path
 * @param timing pacing of the shot
 * @param count number of samples (2..2000)
 * @returns points in screen-time order
 */
export function sampleTimeline(spec: SceneSpec, worldline: Worldline, timing: SceneTiming, count: number): TimelinePoint[] {
  if (!Number.isInteger(count) || count < 2 || count > 2000) throw new RangeError('count: an integer 2..2000');
  const points: TimelinePoint[] = [];
  const span = timing.screenEndS - timing.screenStartS;
  // Turn rate from a small step in screen time (1/1000 of the shot), so keyframe eases show their peaks.
  const dS = span / 1000;
  for (let i = 0; i < count; i++) {
    const screenTime = timing.screenStartS + (span * i) / (count - 1);
    const tau = properTimeAtScreen(timing, worldline, screenTime);
    const readout = readoutAt(spec, worldline, tau);
    const s0 = Math.max(timing.screenStartS, screenTime - dS / 2);
    const s1 = Math.min(timing.screenEndS, screenTime + dS / 2);
    const a = lookInHoleFrame(spec, worldline, properTimeAtScreen(timing, worldline, s0));
    const b = lookInHoleFrame(spec, worldline, properTimeAtScreen(timing, worldline, s1));
    points.push({
      screenTime,
      tau,
      radiusRs: readout.radiusRs,
      band: readout.orbitBand,
      countdownSeconds: readout.countdownSeconds,
      stretchG: readout.stretchG,
      squeezeG: readout.squeezeG,
      thrustG: readout.thrustG,
      shiftMin: readout.shiftRange?.min ?? null,
      shiftMax: readout.shiftRange?.max ?? null,
      lookTurnDegPerS: s1 > s0 ? angleBetweenDeg(a, b) / (s1 - s0) : 0,
    });
  }
  return points;
}

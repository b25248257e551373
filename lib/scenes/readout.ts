/**
 * Physics readouts for a scene at one proper time, in SI for the scene's mass:
 * the numbers the editor, the API and the accuracy report all show.
 * Pure TypeScript (runs on the server and in browser workers).
 */
import {
  boostLookDirection,
  buildWorldline,
  distantObserverTime,
  massScale,
  observeRay,
  sampleWorldline,
  type OrbitBand,
  type Worldline,
} from '@/lib/relativity';
import { toWorldlineSpec, type SceneSpec } from './schema';

/**
 * Head-to-foot stretch often quoted as deadly; illustrative only (common
 * practice, no single source): the readout labels it so.
 */
export const ILLUSTRATIVE_DISRUPTION_THRESHOLD_G = 10;

export type SceneReadout = {
  tau: number;
  tauSeconds: number;
  radiusM: number;
  radiusRs: number;
  radiusKm: number;
  /** Speed measured by a hovering observer at the same place (r > 2 only), units of c. */
  speedRelativeToHover: number | null;
  orbitBand: OrbitBand;
  /** Proper time left to the singularity (the countdown), seconds; null if the path does not reach it. */
  countdownSeconds: number | null;
  /**
   * Time a distant observer at rest counts since the shot began (Schwarzschild t), seconds; null once
   * the camera is at or inside the horizon, which no distant observer ever sees.
   */
  distantTimeSeconds: number | null;
  thrustG: number;
  stretchG: number;
  squeezeG: number;
  bodyLengthMetres: number;
  disruptionThresholdG: number;
  /** Range of the frequency shift g over the whole sky seen by the camera; null where not computed. */
  shiftRange: { min: number; max: number } | null;
  pathDurationM: number;
};

/** Fibonacci sphere: near-uniform directions for sampling the whole view. */
function sphereDirections(count: number): Float64Array {
  const out = new Float64Array(count * 3);
  const golden = Math.PI * (3 - Math.sqrt(5));
  for (let i = 0; i < count; i++) {
    const z = 1 - (2 * (i + 0.5)) / count;
    const ring = Math.sqrt(1 - z * z);
    out[i * 3] = z;
    out[i * 3 + 1] = ring * Math.cos(golden * i);
    out[i * 3 + 2] = ring * Math.sin(golden * i);
  }
  return out;
}
const DIRECTIONS = sphereDirections(600);

/** Shift range over the sky: each direction boosted into the radial reference frame, then traced exactly. */
function shiftRange(r: number, referenceEnergy: number, referenceUr: number, tangentialSpeed: number): { min: number; max: number } | null {
  if (referenceUr > 1e-12) return null; // an outgoing reference observer is outside observeRay's scope
  const observer = Math.abs(referenceUr) <= 1e-12 && r > 2 ? ({ kind: 'static' } as const) : ({ kind: 'radial', energy: referenceEnergy } as const);
  const velocity = [0, tangentialSpeed, 0];
  const reference = new Float64Array(3);
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < DIRECTIONS.length; i += 3) {
    const doppler = boostLookDirection(reference, DIRECTIONS.subarray(i, i + 3), velocity);
    const psi = Math.acos(Math.max(-1, Math.min(1, reference[0])));
    const ray = observeRay(r, psi, observer);
    if (ray.fate !== 'sky') continue;
    const g = ray.g * doppler;
    if (g < min) min = g;
    if (g > max) max = g;
  }
  return Number.isFinite(min) ? { min, max } : null;
}

/** Builds the worldline once; call `readoutAt` for each time. */
export function sceneWorldline(spec: Pick<SceneSpec, 'massSolar' | 'path'>): Worldline {
  return buildWorldline(toWorldlineSpec(spec));
}

/**
 * Readouts at proper time tau (M) along the scene's path.
 * @param bodyLengthMetres length the tides act across (default 2 m, a person)
 */
export function readoutAt(spec: Pick<SceneSpec, 'massSolar'>, worldline: Worldline, tau: number, bodyLengthMetres = 2): SceneReadout {
  // The singularity itself has no readout: clamp to just before the end.
  const end = worldline.endsAtSingularity ? worldline.duration * (1 - 1e-9) : worldline.duration;
  const sample = sampleWorldline(worldline, Math.min(tau, end), bodyLengthMetres);
  const scale = massScale(spec.massSolar);
  const { r, energy } = sample.state;
  const f = 1 - 2 / r;
  const distantM = distantObserverTime(worldline, sample.tau);
  return {
    tau: sample.tau,
    tauSeconds: sample.tau * scale.secondsPerM,
    radiusM: r,
    radiusRs: r / 2,
    radiusKm: (r * scale.metresPerM) / 1000,
    // gamma relative to a static observer is -u.u_static = E / sqrt(f) (physics.md section 3).
    speedRelativeToHover: r > 2 ? Math.sqrt(Math.max(0, 1 - f / (energy * energy))) : null,
    orbitBand: sample.orbitBand,
    countdownSeconds: sample.properTimeLeftSeconds,
    distantTimeSeconds: distantM === null ? null : distantM * scale.secondsPerM,
    thrustG: sample.thrustG,
    stretchG: sample.stretchG,
    squeezeG: sample.squeezeG,
    bodyLengthMetres,
    disruptionThresholdG: ILLUSTRATIVE_DISRUPTION_THRESHOLD_G,
    shiftRange: shiftRange(r, sample.frame.referenceEnergy, sample.frame.referenceUr, sample.frame.tangentialSpeed),
    pathDurationM: worldline.duration,
  };
}

/**
 * The renderer's one doorway into the physics engine (lib/relativity): the
 * camera's reference observer and local boost, the per-frame ray table, star
 * temperatures and blackbody colours. Everything physical comes from
 * lib/relativity; this file only adapts its exports to the renderer's request
 * format and per-frame tables.
 */
import type { CameraState } from './schema';
import {
  RayTable,
  blackbodyLinearSrgb,
  boostLookDirection,
  decomposeFourVelocity,
  radialObserverKinematics,
  temperatureFromBMinusV,
  type RayTableArrays,
} from '../relativity';

/** Camera optics of one frame. */
export interface CameraOptics {
  radiusM: number;
  /** -u_t of the radial reference observer whose frame the ray table uses */
  eps: number;
  /** u^r of that observer */
  ur: number;
  /**
   * For cameras moving across the line of sight: maps a camera-frame look
   * direction (e1, e2, e3 components) into the reference observer's frame,
   * writing it into out, and returns the Doppler factor E_camera / E_reference
   * (lib/relativity boostLookDirection). Null for radial and hovering cameras.
   */
  boost: ((out: Float64Array, n1: number, n2: number, n3: number) => number) | null;
  /**
   * The camera's velocity relative to the reference observer (camera-frame e1, e2, e3 components,
   * units of c) that `boost` applies, for callers that call boostLookDirection themselves; null when
   * `boost` is null.
   */
  velocity: Float64Array | null;
}

/** Boost callback for a camera moving at `velocity` (camera-frame components) relative to the reference observer. */
function makeBoost(velocity: Float64Array): CameraOptics['boost'] {
  const look = new Float64Array(3);
  return (out, n1, n2, n3) => {
    look[0] = n1;
    look[1] = n2;
    look[2] = n3;
    return boostLookDirection(out, look, velocity);
  };
}

/**
 * The radial reference observer and optional boost of a camera state.
 * @param state validated camera state (radii in M)
 * @returns optics for the frame
 * @throws RangeError for impossible states (hovering inside the horizon, energy too low to be at r)
 */
export function engineCameraOptics(state: CameraState): CameraOptics {
  const r = state.radiusM;
  if (state.kind === 'hover') {
    const { eps, ur } = radialObserverKinematics(r, { kind: 'static' }, 'camera.state');
    return { radiusM: r, eps, ur, boost: null, velocity: null };
  }
  if (state.kind === 'radial') {
    const { eps, ur } = radialObserverKinematics(r, { kind: 'radial', energy: state.energy }, 'camera.state');
    if (state.direction === 'out' && !(r > 2)) {
      throw new RangeError('camera.state.direction: "out" needs radiusM > 2 (nothing moves outward inside the horizon)');
    }
    return { radiusM: r, eps, ur: state.direction === 'out' ? -ur : ur, boost: null, velocity: null };
  }
  let ur: number;
  let angle = 0;
  if (state.kind === 'fourVelocity') {
    // normalisation u.u = -1: eps^2 - (u^r)^2 = f (1 + l^2/r^2) (physics.md section 3 with angular momentum)
    const f = 1 - 2 / r;
    const radial2 = state.energy * state.energy - f * (1 + (state.angularMomentum / r) ** 2);
    if (radial2 < -1e-12 * Math.max(1, state.energy * state.energy)) {
      throw new RangeError(`camera.state.energy: too low to be at r = ${r} with angular momentum ${state.angularMomentum}`);
    }
    if (state.direction === 'out' && !(r > 2)) throw new RangeError('camera.state.direction: "out" needs radiusM > 2');
    ur = (state.direction === 'out' ? 1 : -1) * Math.sqrt(Math.max(0, radial2));
    angle = (state.motionAngleDeg * Math.PI) / 180;
  } else {
    ur = state.ur;
  }
  const d = decomposeFourVelocity(r, state.energy, state.angularMomentum, ur);
  const velocity = new Float64Array([0, d.tangentialSpeed * Math.cos(angle), d.tangentialSpeed * Math.sin(angle)]);
  return {
    radiusM: r,
    eps: d.referenceEnergy,
    ur: d.referenceUr,
    boost: d.tangentialSpeed !== 0 ? makeBoost(velocity) : null,
    velocity: d.tangentialSpeed !== 0 ? velocity : null,
  };
}

/**
 * The engine's per-frame ray table for a camera (lib/relativity RayTable.build).
 * @param optics camera optics from engineCameraOptics
 * @returns the table as plain typed arrays, shareable with worker threads
 */
export function engineRayTableArrays(optics: CameraOptics): RayTableArrays {
  return RayTable.build(optics.radiusM, optics.eps, optics.ur).toArrays();
}

/**
 * Rebuild a ray table from its arrays (in a worker, or after copying to shared memory).
 * @param arrays output of engineRayTableArrays
 * @returns the table, ready for per-pixel lookups
 */
export function engineRayTable(arrays: RayTableArrays): RayTable {
  return RayTable.fromArrays(arrays);
}

/** B-V range handed to the engine's formula (catalogue values run from -0.4 to 5.5; the formula needs > -0.6). */
const BV_MIN = -0.5;
const BV_MAX = 6;

/**
 * Blackbody temperature of a star from its B-V index (lib/relativity; Ballesteros 2012, EPL 97, 34008).
 * @param bv B-V colour index, magnitudes (clamped to -0.5..6)
 * @returns temperature in K
 */
export function engineTemperatureFromBv(bv: number): number {
  return temperatureFromBMinusV(Math.min(BV_MAX, Math.max(BV_MIN, bv)));
}

/**
 * Linear sRGB of a blackbody at unit luminance (lib/relativity; CIE 1931 2-degree observer, IEC 61966-2-1).
 * @param temperatureK K, > 0
 * @returns linear r, g, b
 */
export function engineBlackbodyLinearSrgb(temperatureK: number): ArrayLike<number> {
  return blackbodyLinearSrgb(new Float64Array(3), temperatureK);
}

export type { RayTable, RayTableArrays };

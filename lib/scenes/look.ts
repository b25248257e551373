/**
 * Look keyframes: where the frame centre points, which way is up, field of
 * view and roll, interpolated along the path's proper time. Directions are in
 * the camera frame (e1 outward radial, e2 along the orbital motion, e3
 * normal). Between keyframes directions turn along great circles (spherical
 * linear interpolation, Shoemake 1985, SIGGRAPH 19(3), 245) with an
 * ease-in/ease-out (smoothstep) timing so the dome never jerks at a keyframe.
 * Pure TypeScript (browser and server).
 */

export type Vector3 = [number, number, number];

/** One look keyframe as stored in a scene (tau in M, angles in degrees). */
export interface LookKeyframe {
  tau: number;
  look: readonly number[];
  up: readonly number[];
  fovDeg: number;
  rollDeg?: number;
}

/** The interpolated look at one proper time. */
export interface LookState {
  look: Vector3;
  up: Vector3;
  fovDeg: number;
  rollDeg: number;
}

/**
 * Angular speed of the look direction on a dome above which the editor warns
 * (degrees of sky per screen second). Common practice, no single source:
 * venues differ; the number is a setting, and the warning says so.
 */
export const DOME_COMFORT_LIMIT_DEG_PER_S = 30;

function unit(v: readonly number[], name: string): Vector3 {
  if (!Array.isArray(v) || v.length !== 3 || !v.every((c) => Number.isFinite(c))) throw new RangeError(`${name}: three finite numbers`);
  const n = Math.hypot(v[0], v[1], v[2]);
  if (!(n > 1e-12)) throw new RangeError(`${name}: must not be the zero vector`);
  return [v[0] / n, v[1] / n, v[2] / n];
}

/**
 * Spherical linear interpolation between two unit vectors.
 * @param out receives the result (a unit vector)
 * @param a start, unit vector
 * @param b end, unit vector
 * @param t fraction 0..1 (0 gives a exactly, 1 gives b exactly)
 * @returns out
 * Reference: Shoemake 1985. For opposite vectors the turn goes through any perpendicular (chosen deterministically).
 */
export function slerpUnit(out: Vector3, a: readonly number[], b: readonly number[], t: number): Vector3 {
  if (!Number.isFinite(t) || t < 0 || t > 1) throw new RangeError('t: a fraction in [0, 1]');
  if (t === 0) return ((out[0] = a[0]), (out[1] = a[1]), (out[2] = a[2]), out);
  if (t === 1) return ((out[0] = b[0]), (out[1] = b[1]), (out[2] = b[2]), out);
  const cos = Math.max(-1, Math.min(1, a[0] * b[0] + a[1] * b[1] + a[2] * b[2]));
  const angle = Math.acos(cos);
  if (angle < 1e-9) return ((out[0] = a[0]), (out[1] = a[1]), (out[2] = a[2]), out);
  // Orthonormal partner of a in the plane of the turn (b minus its a-component, or any perpendicular when b = -a).
  let px = b[0] - cos * a[0];
  let py = b[1] - cos * a[1];
  let pz = b[2] - cos * a[2];
  let pn = Math.hypot(px, py, pz);
  if (pn < 1e-9) {
    const axis = Math.abs(a[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
    const d = axis[0] * a[0] + axis[1] * a[1] + axis[2] * a[2];
    px = axis[0] - d * a[0];
    py = axis[1] - d * a[1];
    pz = axis[2] - d * a[2];
    pn = Math.hypot(px, py, pz);
  }
  const c = Math.cos(t * angle);
  const s = Math.sin(t * angle) / pn;
  out[0] = c * a[0] + s * px;
  out[1] = c * a[1] + s * py;
  out[2] = c * a[2] + s * pz;
  const n = Math.hypot(out[0], out[1], out[2]);
  out[0] /= n;
  out[1] /= n;
  out[2] /= n;
  return out;
}

/** Smoothstep 3t^2 - 2t^3: zero angular speed at each keyframe (common practice for camera moves). */
function ease(t: number): number {
  return t * t * (3 - 2 * t);
}

/**
 * Keyframes in time order (a stable sort of a copy; the stored order is the producer's).
 * @param keyframes look keyframes (tau in M)
 * @returns sorted copy
 */
export function sortKeyframes<K extends LookKeyframe>(keyframes: readonly K[]): K[] {
  return keyframes.map((k, i) => [k, i] as const).sort((p, q) => p[0].tau - q[0].tau || p[1] - q[1]).map((p) => p[0]);
}

/**
 * The look at proper time tau: holds the first keyframe before it and the last after it.
 * @param keyframes at least one keyframe; look/up need not be normalised but must not be zero
 * @param tau proper time along the path, M (finite)
 * @returns unit look and up vectors (camera frame), field of view and roll in degrees
 * @throws RangeError for no keyframes, a zero vector or a non-finite tau
 */
export function lookAt(keyframes: readonly LookKeyframe[], tau: number): LookState {
  if (!Array.isArray(keyframes) || keyframes.length === 0) throw new RangeError('keyframes: at least one look keyframe');
  if (!Number.isFinite(tau)) throw new RangeError('tau: a finite proper time (M)');
  const keys = sortKeyframes(keyframes);
  const last = keys.length - 1;
  const pick = (k: LookKeyframe): LookState => ({ look: unit(k.look, 'look'), up: unit(k.up, 'up'), fovDeg: k.fovDeg, rollDeg: k.rollDeg ?? 0 });
  if (tau <= keys[0].tau) return pick(keys[0]);
  if (tau >= keys[last].tau) return pick(keys[last]);
  let i = 0;
  while (i < last - 1 && tau >= keys[i + 1].tau) i++;
  const a = keys[i];
  const b = keys[i + 1];
  const span = b.tau - a.tau;
  if (span <= 0) return pick(b);
  const t = ease((tau - a.tau) / span);
  return {
    look: slerpUnit([0, 0, 0], unit(a.look, 'look'), unit(b.look, 'look'), t),
    up: slerpUnit([0, 0, 0], unit(a.up, 'up'), unit(b.up, 'up'), t),
    fovDeg: a.fovDeg + (b.fovDeg - a.fovDeg) * t,
    rollDeg: (a.rollDeg ?? 0) + ((b.rollDeg ?? 0) - (a.rollDeg ?? 0)) * t,
  };
}

/**
 * A camera-frame direction expressed in the hole's fixed frame.
 * @param out receives the direction
 * @param look camera-frame components (e1 outward, e2 tangential, e3 normal)
 * @param radialAxis e1 in the hole frame (unit)
 * @param tangentAxis e2 in the hole frame (unit)
 * @param normalAxis e3 in the hole frame (unit)
 * @returns out
 */
export function cameraToHoleDirection(out: Vector3, look: readonly number[], radialAxis: ArrayLike<number>, tangentAxis: ArrayLike<number>, normalAxis: ArrayLike<number>): Vector3 {
  for (let i = 0; i < 3; i++) out[i] = look[0] * radialAxis[i] + look[1] * tangentAxis[i] + look[2] * normalAxis[i];
  return out;
}

/**
 * Angle between two directions in degrees (robust near 0 and 180 via atan2 of |a x b| and a.b).
 * @param a direction (any length > 0)
 * @param b direction (any length > 0)
 * @returns degrees in [0, 180]
 */
export function angleBetweenDeg(a: readonly number[], b: readonly number[]): number {
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  return (Math.atan2(Math.hypot(cx, cy, cz), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]) * 180) / Math.PI;
}

/**
 * Time seen by a distant observer: Schwarzschild coordinate time t elapsed
 * along a worldline since its start. Along any path dt/dtau = u^t =
 * -u_t / (1 - 2M/r) (the metric's t-t component; -u_t is the state's energy,
 * conserved in free fall, sqrt(f) gamma for a hovering or held camera).
 * It grows without bound as the camera nears r = 2M: a distant observer never
 * sees the camera cross, so beyond the horizon there is no such time.
 * Reference: physics.md sections 2-3; MTW 1973 sec. 31.2 (infall in t).
 */
import { requireInRange } from '../validate';
import type { BuiltSegment, Worldline } from './build';
import { locateSegment, segmentStateAt } from './build';
import type { PathState } from './types';

/** Relative accuracy asked of the quadrature (adaptive Simpson). */
const RELATIVE_TOLERANCE = 1e-10;
/** Deepest interval halving; reached only within ~1e-15 M of the horizon. */
const MAX_DEPTH = 48;

const scratch: PathState = { r: 0, azimuth: 0, energy: 0, angularMomentum: 0, ur: 0 };

/** dt/dtau at local proper time s of a segment. */
function rate(seg: BuiltSegment, s: number): number {
  const state = segmentStateAt(seg, s, scratch);
  return state.energy / (1 - 2 / state.r);
}

function simpson(seg: BuiltSegment, a: number, fa: number, b: number, fb: number, m: number, fm: number, whole: number, tolerance: number, depth: number): number {
  const lm = 0.5 * (a + m);
  const rm = 0.5 * (m + b);
  const flm = rate(seg, lm);
  const frm = rate(seg, rm);
  const left = ((m - a) / 6) * (fa + 4 * flm + fm);
  const right = ((b - m) / 6) * (fm + 4 * frm + fb);
  const delta = left + right - whole;
  if (depth >= MAX_DEPTH || Math.abs(delta) <= 15 * tolerance) return left + right + delta / 15;
  return simpson(seg, a, fa, m, fm, lm, flm, left, tolerance / 2, depth + 1) + simpson(seg, m, fm, b, fb, rm, frm, right, tolerance / 2, depth + 1);
}

/** Coordinate time over local proper times [0, s] of one segment (the camera stays outside r = 2M). */
function segmentTime(seg: BuiltSegment, s: number): number {
  if (!(s > 0)) return 0;
  const fa = rate(seg, 0);
  const fb = rate(seg, s);
  const fm = rate(seg, s / 2);
  const whole = (s / 6) * (fa + 4 * fm + fb);
  return simpson(seg, 0, fa, s, fb, s / 2, fm, whole, RELATIVE_TOLERANCE * Math.abs(whole), 0);
}

// Whole-segment times, computed once per worldline (worldlines are immutable).
const wholeSegmentTimes = new WeakMap<Worldline, number[]>();

/**
 * Schwarzschild coordinate time t elapsed since the start of the path, as a
 * distant observer at rest would count it (in M; times massScale().secondsPerM
 * for seconds).
 * @param worldline from buildWorldline
 * @param tau chain proper time in M, 0 <= tau <= worldline.duration
 * @returns t - t_start in M, or null once the camera is at or inside r = 2M
 *   (no distant observer ever sees that part)
 * @throws RangeError for tau outside the chain
 */
export function distantObserverTime(worldline: Worldline, tau: number): number | null {
  requireInRange('tau', tau, 0, worldline.duration, `a proper time in [0, ${worldline.duration}] M`);
  const { seg, index, local } = locateSegment(worldline, tau);
  const segs = worldline.segments;
  // a path that reaches r = 2M never comes back out, so the camera's radius now decides
  if (!(segmentStateAt(seg, local, scratch).r > 2)) return null;
  let whole = wholeSegmentTimes.get(worldline);
  if (!whole) {
    whole = [];
    wholeSegmentTimes.set(worldline, whole);
  }
  let t = 0;
  for (let k = 0; k < index; k++) {
    whole[k] ??= segmentTime(segs[k], segs[k].duration);
    t += whole[k];
  }
  return t + segmentTime(seg, local);
}

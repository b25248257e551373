/**
 * Validation and construction of segment chains. Each segment starts where
 * the previous one ends (same radius and azimuth); the 4-velocity may jump at
 * a joint (an impulsive burn), except where the physics makes it continuous.
 */
import { fallTimeToSingularity, radiusAtTimeLeft } from '../properTime';
import { integrateGeodesic, sampleGeodesicTrack, type GeodesicTrack } from './geodesicIntegrator';
import type { PathState, WorldlineIssue, WorldlineSegment, WorldlineSpec } from './types';

/** One segment after validation, with everything needed to sample it. */
export interface BuiltSegment {
  index: number;
  kind: WorldlineSegment['kind'];
  /** chain proper time at the segment start, M */
  tauStart: number;
  /** proper-time length, M */
  duration: number;
  start: PathState;
  end: PathState;
  /** radial falls: eps^2 - 1 */
  k: number;
  /** radial falls: proper time from the start to r = 0 along this geodesic, M (Infinity otherwise) */
  timeToSingularity: number;
  /** hover/hold: tangential speed measured by a hovering observer (signed along +azimuth) */
  orbitalSpeed: number;
  /** circular orbit and hold: dphi/dtau, rad per M */
  azimuthRate: number;
  /** free fall with angular momentum: integrated track */
  track: GeodesicTrack | null;
  /** true when the segment ends at the singularity */
  endsAtSingularity: boolean;
}

/** A validated chain ready for sampling. */
export interface Worldline {
  massSolar: number;
  startDirection: Float64Array;
  motionDirection: Float64Array;
  segments: BuiltSegment[];
  /** total proper time, M */
  duration: number;
  endsAtSingularity: boolean;
}

const RADIUS_MATCH_RELATIVE = 1e-9;

function finitePositive(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x) && x > 0;
}

/** Whether a free fall (eps, l, sense) from r reaches r = 0 (effective potential f (1 + l^2/r^2)). */
function freeFallIsCaptured(r: number, eps: number, l: number, sense: 'in' | 'out'): boolean {
  const e2 = eps * eps;
  const l2 = l * l;
  if (r <= 2) return true;
  if (l2 < 12) return sense === 'in' || e2 < 1; // no barrier: anything that comes back in is captured
  // the barrier's top is the unstable circular orbit, the inner root r = (l^2 - sqrt(l^4 - 12 l^2 M^2)) / 2M
  // (Hartle 2003 eq. 9.43; the outer root is the stable orbit at the bottom of the well)
  const rPeak = (l2 - Math.sqrt(l2 * (l2 - 12))) / 2;
  const vPeak = (1 - 2 / rPeak) * (1 + l2 / (rPeak * rPeak));
  if (r < rPeak) return sense === 'in' || e2 < vPeak || e2 < 1;
  return e2 > vPeak && (sense === 'in' || e2 < 1);
}

function checkUnit(v: readonly number[] | undefined, path: string, issues: WorldlineIssue[]): Float64Array | null {
  if (v === undefined) return null;
  if (!Array.isArray(v) || v.length !== 3 || !v.every((x) => Number.isFinite(x))) {
    issues.push({ path, message: 'must be three finite numbers (a unit vector in the hole frame)' });
    return null;
  }
  const n = Math.hypot(v[0], v[1], v[2]);
  if (Math.abs(n - 1) > 1e-6) issues.push({ path, message: `must be a unit vector; its length is ${n}` });
  return Float64Array.from(v);
}

/**
 * Checks a chain and says precisely why it is impossible, as data.
 * @param spec the camera path
 * @returns issues (empty when the chain is possible), each with a field path and message
 */
export function validateWorldline(spec: WorldlineSpec): WorldlineIssue[] {
  return buildChain(spec).issues;
}

/**
 * Builds a chain for sampling.
 * @param spec the camera path (radii in M, durations in M of proper time)
 * @returns the built worldline
 * @throws RangeError listing the issues when the chain is impossible
 */
export function buildWorldline(spec: WorldlineSpec): Worldline {
  const { issues, worldline } = buildChain(spec);
  if (issues.length > 0 || worldline === null) {
    throw new RangeError(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  }
  return worldline;
}

function buildChain(spec: WorldlineSpec): { issues: WorldlineIssue[]; worldline: Worldline | null } {
  const issues: WorldlineIssue[] = [];
  if (spec === null || typeof spec !== 'object') {
    return { issues: [{ path: '', message: 'must be a worldline object' }], worldline: null };
  }
  if (!finitePositive(spec.massSolar)) issues.push({ path: 'massSolar', message: 'must be a finite mass > 0 in solar masses' });
  const start = checkUnit(spec.startDirection, 'startDirection', issues) ?? Float64Array.from([1, 0, 0]);
  const motion = checkUnit(spec.motionDirection, 'motionDirection', issues) ?? Float64Array.from([0, 1, 0]);
  if (Math.abs(start[0] * motion[0] + start[1] * motion[1] + start[2] * motion[2]) > 1e-6) {
    issues.push({ path: 'motionDirection', message: 'must be orthogonal to startDirection' });
  }
  if (!Array.isArray(spec.segments) || spec.segments.length === 0) {
    issues.push({ path: 'segments', message: 'must hold at least one segment' });
    return { issues, worldline: null };
  }
  const built: BuiltSegment[] = [];
  let prev: PathState | null = null;
  let prevAtSingularity = false;
  let tau = 0;
  spec.segments.forEach((seg, index) => {
    const at = `segments[${index}]`;
    const before = issues.length;
    if (prevAtSingularity) {
      issues.push({ path: at, message: 'cannot start: the previous segment ends at the singularity (r = 0)' });
      return;
    }
    const given = (seg as { r?: number }).r;
    let r: number;
    if (given === undefined) {
      if (prev === null) {
        issues.push({ path: `${at}.r`, message: 'the first segment must give its radius r (in M)' });
        return;
      }
      r = prev.r;
    } else if (!finitePositive(given)) {
      issues.push({ path: `${at}.r`, message: 'must be a finite radius > 0 in M' });
      return;
    } else {
      r = given;
      if (prev !== null && Math.abs(r - prev.r) > RADIUS_MATCH_RELATIVE * Math.max(r, prev.r)) {
        issues.push({
          path: `${at}.r`,
          message: `the segment starts at r = ${r} M but the previous segment ends at r = ${prev.r} M; a segment starts where the previous one ends`,
        });
        return;
      }
    }
    const azimuth = prev === null ? 0 : prev.azimuth;
    const where = prev !== null && prev.r <= 2 ? ` (the previous segment ends inside the horizon at r = ${r} M)` : '';
    const f = 1 - 2 / r;
    const out: BuiltSegment = {
      index,
      kind: seg.kind,
      tauStart: tau,
      duration: 0,
      start: { r, azimuth, energy: 0, angularMomentum: 0, ur: 0 },
      end: { r, azimuth, energy: 0, angularMomentum: 0, ur: 0 },
      k: 0,
      timeToSingularity: Infinity,
      orbitalSpeed: 0,
      azimuthRate: 0,
      track: null,
      endsAtSingularity: false,
    };
    const needDuration = (d: unknown): number | null => {
      if (!finitePositive(d)) {
        issues.push({ path: `${at}.duration`, message: 'must be a finite proper time > 0 in M' });
        return null;
      }
      return d;
    };
    // a fall's length: a proper time, the first time r reaches untilR, or neither (to the singularity)
    const untilR = (seg as { untilR?: number }).untilR;
    const untilROk = (): boolean => {
      if (untilR === undefined) return true;
      if (!finitePositive(untilR)) {
        issues.push({ path: `${at}.untilR`, message: 'must be a finite radius > 0 in M' });
        return false;
      }
      if ((seg as { duration?: number }).duration !== undefined) {
        issues.push({ path: `${at}.untilR`, message: 'give either a proper time (duration) or a radius to reach (untilR), not both' });
        return false;
      }
      return true;
    };
    const radialFall = (eps: number, given: number | undefined, k = eps * eps - 1) => {
      out.k = k;
      out.timeToSingularity = fallTimeToSingularity(r, out.k);
      out.start.energy = eps;
      out.start.ur = -Math.sqrt(Math.max(eps * eps - f, 0));
      let d = given;
      if (untilR !== undefined) {
        if (!untilROk()) return;
        if (!(untilR < r)) {
          issues.push({ path: `${at}.untilR`, message: `must be below the radius the fall starts from (r = ${r} M): a radial fall only moves inward` });
          return;
        }
        // proper time from r to untilR: the difference of the times left to the singularity (MTW eq. 31.10 for k < 0)
        d = out.timeToSingularity - fallTimeToSingularity(untilR, out.k);
      }
      if (d === undefined) {
        out.duration = out.timeToSingularity;
        out.endsAtSingularity = true;
      } else if (needDuration(d) !== null) {
        if (d > out.timeToSingularity) {
          issues.push({
            path: `${at}.duration`,
            message: `is ${d} M but the fall reaches the singularity after ${out.timeToSingularity} M of proper time`,
          });
        }
        out.duration = Math.min(d, out.timeToSingularity);
        out.endsAtSingularity = d >= out.timeToSingularity;
      }
    };
    switch (seg.kind) {
      case 'hover':
      case 'hold': {
        if (seg.kind === 'hold' && prev === null) {
          issues.push({ path: at, message: 'a thrusted hold keeps the radius where the previous segment ends: start the chain with hover' });
          return;
        }
        if (!(r > 2)) {
          issues.push({ path: seg.kind === 'hover' ? `${at}.r` : at, message: `${seg.kind} at or inside the horizon is impossible: r must be > 2 M${where}` });
          return;
        }
        const v = seg.kind === 'hold' ? seg.orbitalSpeed ?? 0 : 0;
        if (!(typeof v === 'number' && Number.isFinite(v) && Math.abs(v) < 1)) {
          issues.push({ path: `${at}.orbitalSpeed`, message: 'must be a finite speed with |v| < 1 (the speed of light)' });
          return;
        }
        const d = needDuration(seg.duration);
        if (d === null) return;
        const gamma = 1 / Math.sqrt(1 - v * v);
        out.duration = d;
        out.orbitalSpeed = v;
        out.start.energy = Math.sqrt(f) * gamma;
        out.start.angularMomentum = r * gamma * v;
        out.azimuthRate = (gamma * v) / r;
        break;
      }
      case 'circular-orbit': {
        if (!(r > 3)) {
          issues.push({ path: `${at}.r`, message: `circular orbit inside r = 3 M (the photon sphere) is impossible: r must be > 3 M${where}` });
          return;
        }
        const sense = seg.sense ?? 1;
        if (sense !== 1 && sense !== -1) {
          issues.push({ path: `${at}.sense`, message: 'must be +1 or -1' });
          return;
        }
        const d = needDuration(seg.duration);
        if (d === null) return;
        const root = Math.sqrt(1 - 3 / r);
        out.duration = d;
        out.start.energy = f / root; // Bardeen et al. 1972, eq. 2.12 with a = 0
        out.start.angularMomentum = (sense * Math.sqrt(r)) / root;
        out.azimuthRate = out.start.angularMomentum / (r * r);
        out.orbitalSpeed = sense / Math.sqrt(r - 2);
        break;
      }
      case 'drop': {
        if (!(r > 2)) {
          issues.push({ path: `${at}.r`, message: `drop from rest needs r > 2 M: nothing can be at rest at or inside the horizon${where}` });
          return;
        }
        // k = eps^2 - 1 = -2/r exactly: keeps the turning point at r despite rounding.
        radialFall(Math.sqrt(f), seg.duration, -2 / r);
        break;
      }
      case 'fall': {
        if (!(r > 2)) {
          issues.push({ path: `${at}.r`, message: `a speed measured by a hovering observer needs r > 2 M${where}; use free-fall inside the horizon` });
          return;
        }
        const v = seg.speed;
        if (!(typeof v === 'number' && Number.isFinite(v) && v >= 0 && v < 1)) {
          issues.push({ path: `${at}.speed`, message: 'must be a finite inward speed with 0 <= speed < 1 (the speed of light)' });
          return;
        }
        radialFall(Math.sqrt(f) / Math.sqrt(1 - v * v), seg.duration);
        break;
      }
      case 'free-fall': {
        const { energy: eps, angularMomentum: l, radialSense } = seg;
        if (!(typeof eps === 'number' && Number.isFinite(eps)) || (r > 2 && !(eps > 0))) {
          issues.push({ path: `${at}.energy`, message: 'must be a finite energy -u_t, > 0 outside the horizon' });
          return;
        }
        if (!(typeof l === 'number' && Number.isFinite(l))) {
          issues.push({ path: `${at}.angularMomentum`, message: 'must be a finite angular momentum u_phi in M' });
          return;
        }
        if (radialSense !== 'in' && radialSense !== 'out') {
          issues.push({ path: `${at}.radialSense`, message: "must be 'in' or 'out'" });
          return;
        }
        if (r <= 2 && radialSense === 'out') {
          issues.push({ path: `${at}.radialSense`, message: 'inside the horizon every path moves inward: use \'in\'' });
          return;
        }
        const radial2 = eps * eps - f * (1 + (l * l) / (r * r));
        if (radial2 < -1e-12) {
          issues.push({
            path: `${at}.energy`,
            message: `is too low to be at r = ${r} M with this angular momentum: needs energy >= ${Math.sqrt(f * (1 + (l * l) / (r * r)))}`,
          });
          return;
        }
        const captured = freeFallIsCaptured(r, eps, l, radialSense);
        if (!untilROk()) return;
        if (untilR !== undefined && !captured) {
          issues.push({ path: `${at}.untilR`, message: 'works only for a free fall that reaches the singularity: give this one a proper time (duration) instead' });
          return;
        }
        if (seg.duration === undefined && !captured) {
          issues.push({ path: `${at}.duration`, message: 'is required: this free fall never reaches the singularity' });
          return;
        }
        if (seg.duration !== undefined && needDuration(seg.duration) === null) return;
        const ur = (radialSense === 'in' ? -1 : 1) * Math.sqrt(Math.max(radial2, 0));
        out.start.energy = eps;
        out.start.angularMomentum = l;
        out.start.ur = ur;
        const track = integrateGeodesic(r, ur, azimuth, l, seg.duration ?? Infinity);
        out.track = track;
        out.timeToSingularity = track.singularityTau;
        if (untilR !== undefined) {
          const reached = firstCrossing(track, untilR);
          if (reached === null) {
            issues.push({ path: `${at}.untilR`, message: `is never reached: this free fall goes from r = ${r} M to the singularity without passing r = ${untilR} M` });
            return;
          }
          out.duration = reached;
        } else if (seg.duration === undefined || seg.duration >= track.singularityTau) {
          if (seg.duration !== undefined && seg.duration > track.singularityTau) {
            issues.push({ path: `${at}.duration`, message: `is ${seg.duration} M but the fall reaches the singularity after ${track.singularityTau} M of proper time` });
          }
          out.duration = track.singularityTau;
          out.endsAtSingularity = true;
        } else {
          out.duration = seg.duration;
        }
        break;
      }
      default:
        issues.push({ path: `${at}.kind`, message: "must be one of 'hover', 'circular-orbit', 'drop', 'fall', 'free-fall', 'hold'" });
        return;
    }
    if (issues.length > before) return;
    out.end = endState(out);
    built.push(out);
    prev = out.end;
    prevAtSingularity = out.endsAtSingularity;
    tau += out.duration;
  });
  if (issues.length > 0) return { issues, worldline: null };
  return {
    issues,
    worldline: {
      massSolar: spec.massSolar,
      startDirection: start,
      motionDirection: motion,
      segments: built,
      duration: tau,
      endsAtSingularity: prevAtSingularity,
    },
  };
}

/**
 * The segment a chain proper time falls in (the earlier one on a joint) and the time into it.
 * @param worldline from buildWorldline
 * @param tau chain proper time in M (the caller checks it lies on the chain)
 * @returns the segment, its index and the local proper time, clamped to [0, duration]
 */
export function locateSegment(worldline: Worldline, tau: number): { seg: BuiltSegment; index: number; local: number } {
  const segs = worldline.segments;
  let index = 0;
  while (index < segs.length - 1 && tau > segs[index].tauStart + segs[index].duration) index++;
  const seg = segs[index];
  return { seg, index, local: Math.min(Math.max(tau - seg.tauStart, 0), seg.duration) };
}

const scratch = new Float64Array(3);

/** State of a built segment at local proper time s (0 <= s <= duration). */
export function segmentStateAt(seg: BuiltSegment, s: number, out: PathState): PathState {
  const { start } = seg;
  out.energy = start.energy;
  out.angularMomentum = start.angularMomentum;
  switch (seg.kind) {
    case 'hover':
    case 'hold':
    case 'circular-orbit':
      out.r = start.r;
      out.ur = 0;
      out.azimuth = start.azimuth + seg.azimuthRate * s;
      return out;
    case 'drop':
    case 'fall': {
      const left = Math.max(seg.timeToSingularity - s, 0);
      const r = radiusAtTimeLeftClamped(left, seg.k, start.r);
      out.r = r;
      out.azimuth = start.azimuth;
      out.ur = r > 0 ? -Math.sqrt(Math.max(seg.k + 2 / r, 0)) : -Infinity;
      return out;
    }
    case 'free-fall': {
      const track = seg.track as GeodesicTrack;
      if (s >= track.singularityTau) {
        out.r = 0;
        out.ur = -Infinity;
        out.azimuth = track.phi[track.count - 1];
        return out;
      }
      const [r, ur, azimuth] = sampleTrack(track, s);
      out.r = r;
      out.ur = ur;
      out.azimuth = azimuth;
      return out;
    }
  }
  return out;
}

function radiusAtTimeLeftClamped(left: number, k: number, rStart: number): number {
  return left <= 0 ? 0 : radiusAtTimeLeft(left, k, rStart);
}

function sampleTrack(track: GeodesicTrack, s: number): Float64Array {
  return sampleGeodesicTrack(scratch, track, s);
}

/**
 * Proper time at which a track first reaches radius `target` (M): the first sample step whose ends straddle
 * it, then bisection on the track's own interpolant.
 * @returns proper time from the track's start in M, or null when the track never reaches `target`
 */
function firstCrossing(track: GeodesicTrack, target: number): number | null {
  const side = Math.sign(track.r[0] - target);
  if (side === 0) return null;
  for (let i = 1; i < track.count; i++) {
    if (Math.sign(track.r[i] - target) === side) continue;
    let lo = track.tau[i - 1];
    let hi = Math.min(track.tau[i], track.singularityTau);
    for (let k = 0; k < 80 && hi - lo > 1e-13 * Math.max(1, hi); k++) {
      const mid = 0.5 * (lo + hi);
      if (Math.sign(sampleTrack(track, mid)[0] - target) === side) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  }
  return null;
}

function endState(seg: BuiltSegment): PathState {
  return segmentStateAt(seg, seg.duration, { r: 0, azimuth: 0, energy: 0, angularMomentum: 0, ur: 0 });
}

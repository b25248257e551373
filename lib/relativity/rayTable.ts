/**
 * Per-frame ray table: for one camera event and radially moving (or hovering)
 * reference observer, phi(psi) is tabulated once so each pixel costs a lookup
 * instead of an integration.
 *
 * Layout. The look angle psi in [0, pi] is cut at the shadow edge (b = b_c,
 * where phi diverges like -log|psi - psi_edge|, Bozza 2002), at the other
 * b = b_c crossing (singular only for r near 3), and inside the horizon at the
 * horizon image E = 0 (a kink and a change of fate). Each interval is split
 * in two halves; a half touching a singular crossing is sampled uniformly in
 * t = log|psi - crossing| (so the logarithmic wrap becomes a straight line),
 * the others uniformly in psi. Values come from the exact tracer; node slopes
 * from fourth-order differences; lookup is cubic Hermite in t, and below the
 * closest node to a crossing it continues the straight line in t.
 */
import { CRITICAL_IMPACT_PARAMETER_M } from './constants';
import { createRayTrace, criticalCentre, criticalExcess, FATE_FAR_SIDE, FATE_HORIZON, FATE_SKY, traceRadialObserverRay } from './rayTrace';
import { requireAbove, requireFinite, requireInRange } from './validate';

const MAP_UNIFORM = 0;
const MAP_LOG_FROM_LEFT = 1;
const MAP_LOG_TO_RIGHT = 2;

/** Closest distance in psi (rad) to a singular crossing that gets a node; see README. */
const LOG_NEAREST_RAD = 1e-9;
/** Node spacing in t = log(distance) (dimensionless). */
const LOG_STEP = 0.03;
/**
 * Closest distance to a break the lookup resolves, radians: an exact hit on a crossing (where phi
 * diverges) is read at this distance, so the result stays finite.
 */
const NEAREST_DISTANCE_RAD = 1e-300;
/**
 * |dphi/dt| at a log segment's nearest node (1e-9 rad from its break) below which the break is smooth:
 * there dphi/dt = d * dphi/dpsi is ~1e-9 times a finite derivative, whereas at a crossing it tends to a
 * constant of order one (Bozza 2002, strong-deflection coefficient).
 */
const SMOOTH_ANCHOR_SLOPE = 1e-5;
/** Node count of a uniformly sampled half (at least). */
const UNIFORM_NODES = 256;
/** Header: r, eps, ur, segment count, psiEdge, psiEnergyZero. */
const HEADER_LENGTH = 6;
/** Per segment: map, psiLo, psiHi, anchor, t0, dt, offset, count, fate. */
const SEGMENT_STRIDE = 9;

/** Plain typed arrays that fully describe a table (transferable to workers, uploadable as textures). */
export interface RayTableArrays {
  /** header (HEADER_LENGTH numbers) followed by SEGMENT_STRIDE numbers per segment */
  layout: Float64Array;
  /** phi at the nodes, radians */
  phi: Float64Array;
  /** dphi/dt at the nodes (t is the segment's sampling variable) */
  slope: Float64Array;
}

/** Output of {@link RayTable.lookup} (reuse one record; nothing is allocated per pixel). */
export interface RayLookup {
  /** 0 sky, 1 horizon, 2 far side (FATE_* codes) */
  fate: number;
  /** azimuth swept; for horizon/far-side rays the angular position where the ray meets r = 2 */
  phi: number;
  /** observed energy over energy at infinity (reference observer) */
  g: number;
  /** d phi / d psi */
  dPhiDPsi: number;
  /** lensing Jacobian |dOmega_screen / dOmega_sky| = sin psi / |sin phi dphi/dpsi| (Infinity on caustics) */
  jacobian: number;
}

/** A fresh lookup record. */
export function createRayLookup(): RayLookup {
  return { fate: FATE_SKY, phi: 0, g: 1, dPhiDPsi: 1, jacobian: 1 };
}

/**
 * b(psi) = b_c crossings in [0, pi] with E > 0. The condition
 * r sin psi + b_c u^r cos psi = b_c eps reads A sin(psi + delta) = b_c eps with
 * A^2 = r^2 + 27 u^r^2, so psi = pi/2 - delta +- acos(b_c eps / A); the half-gap
 * uses A^2 - 27 eps^2 = (r - 3)^2 (r + 6)/r, exact, so crossings stay accurate
 * where they merge at r = 3.
 */
function criticalCrossings(r: number, eps: number, ur: number): number[] {
  const bc = CRITICAL_IMPACT_PARAMETER_M;
  const amp = Math.hypot(r, bc * ur);
  const centre = criticalCentre(r, ur);
  const gap = ((r - 3) * (r - 3) * (r + 6)) / r; // A^2 - b_c^2 eps^2
  const oneMinusRatio = gap / (amp * (amp + bc * eps));
  if (!(oneMinusRatio >= 0 && oneMinusRatio <= 2)) return [];
  const half = 2 * Math.asin(Math.sqrt(0.5 * oneMinusRatio));
  const found: number[] = [];
  for (const psi of half === 0 ? [centre] : [centre - half, centre + half]) {
    if (psi > 0 && psi < Math.PI && eps - Math.cos(psi) * ur > 0) found.push(psi);
  }
  return found;
}

/** Exact offsets (psi - centre) of the crossings, keyed by crossing psi. */
function crossingOffsetMap(r: number, eps: number, ur: number, crossings: number[]): Map<number, number> {
  const centre = criticalCentre(r, ur);
  const map = new Map<number, number>();
  if (crossings.length === 0) return map;
  const amp = Math.hypot(r, CRITICAL_IMPACT_PARAMETER_M * ur);
  const gap = ((r - 3) * (r - 3) * (r + 6)) / r;
  const half = 2 * Math.asin(Math.sqrt((0.5 * gap) / (amp * (amp + CRITICAL_IMPACT_PARAMETER_M * eps))));
  for (const psi of crossings) map.set(psi, psi < centre ? -half : psi > centre ? half : 0);
  return map;
}

/** Finite-difference slopes (fourth order) of equally spaced values. */
function fillSlopes(values: Float64Array, slopes: Float64Array, offset: number, n: number, dt: number): void {
  const v = (i: number) => values[offset + i];
  const inv = 1 / (12 * dt);
  if (n < 5) {
    for (let i = 0; i < n; i++) {
      const a = Math.max(i - 1, 0);
      const b = Math.min(i + 1, n - 1);
      slopes[offset + i] = (v(b) - v(a)) / ((b - a) * dt);
    }
    return;
  }
  slopes[offset] = (-25 * v(0) + 48 * v(1) - 36 * v(2) + 16 * v(3) - 3 * v(4)) * inv;
  slopes[offset + 1] = (-3 * v(0) - 10 * v(1) + 18 * v(2) - 6 * v(3) + v(4)) * inv;
  for (let i = 2; i < n - 2; i++) slopes[offset + i] = (-v(i + 2) + 8 * v(i + 1) - 8 * v(i - 1) + v(i - 2)) * inv;
  const m = n - 1;
  slopes[offset + m] = (25 * v(m) - 48 * v(m - 1) + 36 * v(m - 2) - 16 * v(m - 3) + 3 * v(m - 4)) * inv;
  slopes[offset + m - 1] = (3 * v(m) + 10 * v(m - 1) - 18 * v(m - 2) + 6 * v(m - 3) - v(m - 4)) * inv;
}

interface SegmentPlan {
  map: number;
  lo: number;
  hi: number;
  anchor: number;
  /** the anchor is a smooth break (k^r = 0 or the horizon image), graded logarithmically only for detail */
  smooth: boolean;
}

/** Distance from a smooth break within which phi is treated as linear in the distance, radians. */
const SMOOTH_LINEAR_RAD = 1e-5;

/**
 * Nodes of a log segment next to a smooth break: within 1e-5 rad phi is linear in the distance d = e^t
 * (to ~phi'' d^2 = 1e-10 rad), so the nodes there take the secant line from the first node to the one
 * nearest 1e-5 rad, and dphi/dt = d dphi/dd. The traced phi carries ~4e-9 rad of roundoff beside k^r = 0,
 * which differences over the first nodes' 3e-11 rad steps would blow up into wrong slopes.
 */
function fillSmoothSlopes(values: Float64Array, slopes: Float64Array, offset: number, n: number, t0: number, dt: number): void {
  const m = Math.min(n - 1, Math.max(1, Math.round((Math.log(SMOOTH_LINEAR_RAD) - t0) / dt)));
  const d0 = Math.exp(t0);
  const perRad = (values[offset + m] - values[offset]) / (Math.exp(t0 + m * dt) - d0);
  for (let i = 0; i < m; i++) {
    const d = Math.exp(t0 + i * dt);
    values[offset + i] = values[offset] + (d - d0) * perRad;
    slopes[offset + i] = d * perRad;
  }
}

/**
 * A ray table for one camera state; lookups reproduce the exact tracer
 * (observeRay) within the bound stated in lib/relativity/README.md.
 */
export class RayTable {
  readonly layout: Float64Array;
  readonly phi: Float64Array;
  readonly slope: Float64Array;
  private readonly r: number;
  private readonly eps: number;
  private readonly ur: number;
  private readonly segmentCount: number;

  private constructor(arrays: RayTableArrays) {
    this.layout = arrays.layout;
    this.phi = arrays.phi;
    this.slope = arrays.slope;
    this.r = this.layout[0];
    this.eps = this.layout[1];
    this.ur = this.layout[2];
    this.segmentCount = this.layout[3];
  }

  /**
   * Builds the table for a radial reference observer at radius r.
   * @param r radius in M, > 0
   * @param eps reference observer's -u_t (> 0 outside the horizon)
   * @param ur reference observer's u^r (< 0 inside the horizon), with eps^2 - ur^2 = 1 - 2/r
   * @returns the table
   * @throws RangeError for inconsistent arguments
   * Reference: physics.md section 5; Bozza 2002 for the logarithmic edge.
   */
  static build(r: number, eps: number, ur: number): RayTable {
    requireAbove('r', r, 0, 'a finite radius > 0 in units of M');
    requireFinite('eps', eps, 'the reference observer energy -u_t');
    requireFinite('ur', ur, "the reference observer's u^r");
    const f = 1 - 2 / r;
    if (Math.abs(eps * eps - ur * ur - f) > 1e-9 * Math.max(1, eps * eps)) {
      throw new RangeError(`eps and ur must satisfy eps^2 - ur^2 = 1 - 2/r (a unit timelike radial observer); got ${eps}, ${ur} at r = ${r}`);
    }
    if (r > 2 && !(eps > 0)) throw new RangeError(`eps must be > 0 outside the horizon; got ${eps}`);
    if (r <= 2 && !(ur < 0)) throw new RangeError(`ur must be < 0 at or inside the horizon (future-directed); got ${ur}`);
    const crossings = criticalCrossings(r, eps, ur);
    const crossingOffsets = crossingOffsetMap(r, eps, ur, crossings);
    // Breakpoints: singular crossings, and the horizon image (E = 0) inside.
    // The horizon image is not singular, but phi changes on a scale that shrinks
    // deep inside the hole, so it is graded logarithmically too.
    const breaks: { psi: number; singular: boolean; smooth?: boolean }[] = crossings.map((psi) => ({ psi, singular: true }));
    if (r <= 2) {
      // E = 0 at cos psi = eps/ur.
      const c = eps / ur;
      if (c > -1 && c < 1) breaks.push({ psi: Math.acos(c), singular: true, smooth: true });
    } else {
      // k^r = 0 (the camera sits at the ray's turning point), cos psi = ur/eps: smooth, but with a
      // structure as fine as the gap between the turning point and the photon sphere near r = 3.
      const turning = Math.acos(Math.max(-1, Math.min(1, ur / eps)));
      if (turning > 0 && turning < Math.PI && !breaks.some((b) => Math.abs(b.psi - turning) < 1e-12)) {
        breaks.push({ psi: turning, singular: true, smooth: true });
      }
    }
    breaks.sort((a, b) => a.psi - b.psi);
    const points: { psi: number; singular: boolean; smooth?: boolean }[] = [{ psi: 0, singular: false }, ...breaks, { psi: Math.PI, singular: false }];
    const plans: SegmentPlan[] = [];
    for (let i = 0; i + 1 < points.length; i++) {
      const a = points[i];
      const b = points[i + 1];
      if (!(b.psi > a.psi)) continue;
      const mid = 0.5 * (a.psi + b.psi);
      plans.push({ map: a.singular ? MAP_LOG_FROM_LEFT : MAP_UNIFORM, lo: a.psi, hi: mid, anchor: a.psi, smooth: a.smooth === true });
      plans.push({ map: b.singular ? MAP_LOG_TO_RIGHT : MAP_UNIFORM, lo: mid, hi: b.psi, anchor: b.psi, smooth: b.smooth === true });
    }
    const counts = plans.map((p) => {
      if (p.map === MAP_UNIFORM) return UNIFORM_NODES;
      const span = p.hi - p.lo;
      return span > LOG_NEAREST_RAD ? Math.max(5, Math.ceil(Math.log(span / LOG_NEAREST_RAD) / LOG_STEP) + 1) : 5;
    });
    const total = counts.reduce((s, n) => s + n, 0);
    const layout = new Float64Array(HEADER_LENGTH + SEGMENT_STRIDE * plans.length);
    const phi = new Float64Array(total);
    const slope = new Float64Array(total);
    const edge = crossings.length > 0 ? edgeCrossing(r, eps, ur, crossings) : NaN;
    const energyZero = r <= 2 ? Math.acos(Math.max(-1, Math.min(1, eps / ur))) : NaN;
    layout.set([r, eps, ur, plans.length, edge, energyZero]);
    const trace = createRayTrace();
    let offset = 0;
    plans.forEach((p, k) => {
      const n = counts[k];
      let t0: number;
      let dt: number;
      if (p.map === MAP_UNIFORM) {
        t0 = p.lo;
        dt = (p.hi - p.lo) / (n - 1);
      } else {
        const span = Math.max(p.hi - p.lo, LOG_NEAREST_RAD * 1.0001);
        const tMax = Math.log(span);
        t0 = Math.log(Math.min(LOG_NEAREST_RAD, span / 2));
        dt = (tMax - t0) / (n - 1);
      }
      const cosA = Math.cos(p.anchor);
      const sinA = Math.sin(p.anchor);
      const centre = criticalCentre(r, ur);
      // Offset of the anchor from the crossings' centre, exact for crossing anchors.
      const anchorOffset = crossingOffsets.get(p.anchor) ?? p.anchor - centre;
      let fate = FATE_SKY;
      for (let i = 0; i < n; i++) {
        const t = t0 + i * dt;
        let c: number;
        let s: number;
        let w: number;
        if (p.map === MAP_UNIFORM) {
          c = Math.cos(t);
          s = Math.sin(t);
          w = t - centre;
        } else {
          // psi = anchor +- d, by angle addition so tiny d keeps its digits.
          const d = p.map === MAP_LOG_FROM_LEFT ? Math.exp(t) : -Math.exp(t);
          const cd = Math.cos(d);
          const sd = Math.sin(d);
          c = cosA * cd - sinA * sd;
          s = Math.max(sinA * cd + cosA * sd, 0);
          w = anchorOffset + d;
        }
        const excess = eps - c * ur > 0 && s > 0 ? criticalExcess(r, eps, ur, w, c, s) : NaN;
        traceRadialObserverRay(r, c, s, eps, ur, trace, excess);
        phi[offset + i] = trace.phi;
        if (i === (n >> 1)) fate = trace.fate;
      }
      fillSlopes(phi, slope, offset, n, dt);
      if (p.smooth && p.map !== MAP_UNIFORM) fillSmoothSlopes(phi, slope, offset, n, t0, dt);
      layout.set([p.map, p.lo, p.hi, p.anchor, t0, dt, offset, n, fate], HEADER_LENGTH + SEGMENT_STRIDE * k);
      offset += n;
    });
    return new RayTable({ layout, phi, slope });
  }

  /**
   * Rebuilds a table from arrays made by {@link RayTable.toArrays} (e.g. in a worker).
   * @param arrays the three typed arrays
   */
  static fromArrays(arrays: RayTableArrays): RayTable {
    if (!(arrays.layout instanceof Float64Array) || arrays.layout.length < HEADER_LENGTH) {
      throw new RangeError('arrays.layout must be the Float64Array made by RayTable.toArrays');
    }
    return new RayTable(arrays);
  }

  /** The table as plain typed arrays (shareable with workers; convertible to a float texture). */
  toArrays(): RayTableArrays {
    return { layout: this.layout, phi: this.phi, slope: this.slope };
  }

  /** Look angle of the shadow edge (b = b_c fate boundary), radians, or NaN if none. */
  get shadowEdgePsi(): number {
    return this.layout[4];
  }

  /** Look angle of the horizon image (E = 0) inside the horizon, radians, or NaN outside. */
  get horizonImagePsi(): number {
    return this.layout[5];
  }

  /**
   * Per-pixel lookup, allocation-free.
   * @param psi look angle from the outward radial direction in the reference observer's frame, radians, [0, pi]
   * @param out record written (fate, phi, g, dPhiDPsi, jacobian)
   * @returns out
   */
  lookup(psi: number, out: RayLookup): RayLookup {
    const L = this.layout;
    let base = HEADER_LENGTH;
    const last = HEADER_LENGTH + SEGMENT_STRIDE * (this.segmentCount - 1);
    while (base < last && psi > L[base + 2]) base += SEGMENT_STRIDE;
    const map = L[base];
    const t0 = L[base + 4];
    const dt = L[base + 5];
    const offset = L[base + 6];
    const n = L[base + 7];
    let t: number;
    let dtDpsi: number;
    // distance from the segment's anchor, radians (log maps only); floored so an exact hit stays finite
    let d = 0;
    if (map === MAP_UNIFORM) {
      t = psi;
      dtDpsi = 1;
    } else {
      d = Math.max(map === MAP_LOG_FROM_LEFT ? psi - L[base + 3] : L[base + 3] - psi, NEAREST_DISTANCE_RAD);
      t = Math.log(d);
      dtDpsi = map === MAP_LOG_FROM_LEFT ? 1 / d : -1 / d;
    }
    const x = (t - t0) / dt;
    let phiValue: number;
    let dPhiDt: number;
    if (x <= 0 && Math.abs(this.slope[offset]) < SMOOTH_ANCHOR_SLOPE) {
      // Closer than the nearest node to a smooth break (k^r = 0, or the horizon image): phi is smooth
      // in psi there, so dphi/dt = d dphi/dd vanishes with d; extrapolate linearly in d, not in t.
      const d0 = Math.exp(t0);
      const dPhiDd = this.slope[offset] / d0; // fillSmoothSlopes: slope = d dphi/dd
      phiValue = this.phi[offset] + dPhiDd * (d - d0);
      out.fate = L[base + 8];
      return this.finish(psi, phiValue, dPhiDd * (map === MAP_LOG_FROM_LEFT ? 1 : -1), out);
    } else if (x <= 0) {
      // Beyond the closest node to a crossing: phi is linear in log-distance there (Bozza 2002).
      phiValue = this.phi[offset] + this.slope[offset] * (t - t0);
      dPhiDt = this.slope[offset];
    } else {
      let i = Math.floor(x);
      if (i > n - 2) i = n - 2;
      const s = x - i;
      const k = offset + i;
      const p0 = this.phi[k];
      const p1 = this.phi[k + 1];
      const m0 = this.slope[k] * dt;
      const m1 = this.slope[k + 1] * dt;
      const s2 = s * s;
      const s3 = s2 * s;
      phiValue = (2 * s3 - 3 * s2 + 1) * p0 + (s3 - 2 * s2 + s) * m0 + (-2 * s3 + 3 * s2) * p1 + (s3 - s2) * m1;
      dPhiDt = ((6 * s2 - 6 * s) * p0 + (3 * s2 - 4 * s + 1) * m0 + (-6 * s2 + 6 * s) * p1 + (3 * s2 - 2 * s) * m1) / dt;
    }
    out.fate = L[base + 8];
    return this.finish(psi, phiValue, dPhiDt * dtDpsi, out);
  }

  /** Fills the lookup record from phi and dphi/dpsi: shift g and the lensing Jacobian. */
  private finish(psi: number, phiValue: number, dPhiDPsi: number, out: RayLookup): RayLookup {
    const energy = this.eps - Math.cos(psi) * this.ur;
    out.phi = phiValue;
    out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
    out.dPhiDPsi = dPhiDPsi;
    const sinPsi = Math.sin(psi);
    const denominator = Math.abs(Math.sin(phiValue) * dPhiDPsi);
    // At psi = 0 (phi = 0) the ratio tends to 1/(dphi/dpsi)^2.
    out.jacobian = sinPsi < 1e-12 && Math.abs(phiValue) < 1e-9 ? 1 / (dPhiDPsi * dPhiDPsi) : denominator === 0 ? Infinity : sinPsi / denominator;
    return out;
  }
}

/** The crossing that separates fates (physics.md section 5 rules). */
function edgeCrossing(r: number, eps: number, ur: number, crossings: number[]): number {
  for (const psi of crossings) {
    const kr = ur - Math.cos(psi) * eps;
    if (r > 3 && kr > 0) return psi;
    if (r > 2 && r <= 3 && kr <= 0) return psi;
    if (r <= 2) return psi;
  }
  return crossings[0];
}

/**
 * Convenience: table for a static or inward radial geodesic observer.
 * @param r radius in M (> 0; > 2 for static)
 * @param energy -u_t of the inward radial observer, or null for a hovering one
 */
export function buildRayTableForRadialObserver(r: number, energy: number | null): RayTable {
  requireAbove('r', r, 0, 'a finite radius > 0 in units of M');
  const f = 1 - 2 / r;
  if (energy === null) {
    if (!(r > 2)) throw new RangeError(`r must be > 2 (outside the horizon) for a static observer; got ${r}`);
    return RayTable.build(r, Math.sqrt(f), 0);
  }
  requireInRange('energy', energy, 0, Number.MAX_VALUE, 'energy = -u_t, finite and >= 0');
  const radial2 = energy * energy - f;
  if (radial2 < -1e-12) throw new RangeError(`energy must be >= sqrt(1 - 2/r) = ${Math.sqrt(f)} at r = ${r}; got ${energy}`);
  return RayTable.build(r, energy, -Math.sqrt(Math.max(radial2, 0)));
}

export { FATE_FAR_SIDE, FATE_HORIZON, FATE_SKY };

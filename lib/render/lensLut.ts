/**
 * A faster front for the engine's per-frame ray table (lib/relativity
 * RayTable): a uniform grid over the look angle psi holding phi, dphi/dpsi,
 * cos(phi) and sin(phi) from the engine, interpolated by cubic Hermite (the
 * cosine and sine with their exact derivatives -sin(phi) phi' and
 * cos(phi) phi', which saves the per-pixel trigonometry). Every grid bin is
 * checked against the engine at three inner points when built; bins where
 * the fate changes or the Hermite values miss the engine by more than
 * LUT_TOLERANCE_RAD (around the shadow edge, where phi diverges
 * logarithmically, Bozza 2002) hand the lookup to the engine table itself.
 * So the per-pixel result always agrees with the engine within the stated
 * tolerance.
 */
import { createRayLookup, type RayLookup, type RayTable } from '../relativity';

/** Bins over 0..pi. */
const LUT_BINS = 8192;
/** Largest phi (or cos/sin phi) disagreement accepted inside a bin before it defers to the engine, radians. */
export const LUT_TOLERANCE_RAD = 1e-7;

/** Uniform Hermite grid over psi with per-bin fallback to the engine. */
export interface LensLut {
  table: RayTable;
  /** phi at nodes k * pi / LUT_BINS */
  phi: Float64Array;
  /** dphi/dpsi at the nodes */
  slope: Float64Array;
  /** cos(phi) and sin(phi) at the nodes */
  cosPhi: Float64Array;
  sinPhi: Float64Array;
  /** fate of each bin, or 255 when the bin defers to the engine */
  binFate: Uint8Array;
  /** eps and u^r of the reference observer, for g = 1 / |eps - u^r cos psi| (physics.md section 5) */
  eps: number;
  ur: number;
}

const DEFER = 255;
/** Offset either side of a node whose own lookup is not finite, radians (outside the table's unreliable zone). */
const NODE_NUDGE_RAD = 1e-4;
/** Offset of a deferred lookup that hit such a point exactly, radians. */
const LOOKUP_NUDGE_RAD = 1e-12;
const BIN_RAD = Math.PI / LUT_BINS;

/**
 * Cubic Hermite of bin k at fraction s (0..1) into out: [0] phi, [1] dphi/dpsi, [2] cos phi, [3] sin phi.
 * Values and node slopes are the engine's; cos and sin use slopes -sin(phi) phi' and cos(phi) phi'.
 */
function hermite(lut: LensLut, k: number, s: number, out: Float64Array): void {
  const h = BIN_RAD;
  const s2 = s * s;
  const s3 = s2 * s;
  const h00 = 2 * s3 - 3 * s2 + 1;
  const h10 = s3 - 2 * s2 + s;
  const h01 = -2 * s3 + 3 * s2;
  const h11 = s3 - s2;
  const m0 = lut.slope[k] * h;
  const m1 = lut.slope[k + 1] * h;
  const p0 = lut.phi[k];
  const p1 = lut.phi[k + 1];
  out[0] = h00 * p0 + h10 * m0 + h01 * p1 + h11 * m1;
  out[1] = ((6 * s2 - 6 * s) * p0 + (3 * s2 - 4 * s + 1) * m0 + (-6 * s2 + 6 * s) * p1 + (3 * s2 - 2 * s) * m1) / h;
  const c0 = lut.cosPhi[k];
  const c1 = lut.cosPhi[k + 1];
  const n0 = lut.sinPhi[k];
  const n1 = lut.sinPhi[k + 1];
  out[2] = h00 * c0 - h10 * n0 * m0 + h01 * c1 - h11 * n1 * m1;
  out[3] = h00 * n0 + h10 * c0 * m0 + h01 * n1 + h11 * c1 * m1;
}

/**
 * Build the grid from an engine table.
 * @param table the frame's RayTable
 * @param eps reference observer's -u_t
 * @param ur reference observer's u^r
 * @returns the grid
 */
export function buildLensLut(table: RayTable, eps: number, ur: number): LensLut {
  const n = LUT_BINS;
  const h = BIN_RAD;
  const phi = new Float64Array(n + 1);
  const slope = new Float64Array(n + 1);
  const fate = new Uint8Array(n + 1);
  const rec = createRayLookup();
  const side = createRayLookup();
  // look angle where k^r = 0 (the ray's turning point is the camera), cos psi = ur / eps; none inside
  const turningPsi = eps > 0 && Math.abs(ur / eps) < 1 ? Math.acos(ur / eps) : NaN;
  for (let k = 0; k <= n; k++) {
    table.lookup(k * h, rec);
    phi[k] = rec.phi;
    slope[k] = rec.dPhiDPsi;
    fate[k] = rec.fate;
    if (!Number.isFinite(rec.phi) || !Number.isFinite(rec.dPhiDPsi) || Math.abs(k * h - turningPsi) < NODE_NUDGE_RAD) {
      // within 1e-4 rad of the camera's turning point (k^r = 0, e.g. psi = pi/2 for a hovering camera) the
      // traced phi carries a ~1e-9 rad bias that flips sign across it, so the table's dphi/dpsi there is good
      // to only ~1e-4 relative (phi itself to ~1e-9 rad). Where phi is smooth across the node, use the mean
      // of phi either side and their central difference (errors ~2e-9 rad and ~1e-7 relative); a true
      // singularity changes fate or stays NaN and its bins defer to the table
      const a = Math.max(0, k * h - NODE_NUDGE_RAD);
      const b = Math.min(Math.PI, k * h + NODE_NUDGE_RAD);
      table.lookup(a, side);
      const phiA = side.phi;
      const fateA = side.fate;
      table.lookup(b, side);
      if (fateA === side.fate && Number.isFinite(phiA) && Number.isFinite(side.phi)) {
        phi[k] = 0.5 * (phiA + side.phi);
        slope[k] = (side.phi - phiA) / (b - a);
        fate[k] = fateA;
      }
    }
  }
  const cosPhi = phi.map(Math.cos);
  const sinPhi = phi.map(Math.sin);
  const lut: LensLut = { table, phi, slope, cosPhi, sinPhi, binFate: new Uint8Array(n), eps, ur };
  const test = new Float64Array(4);
  for (let k = 0; k < n; k++) {
    let ok = fate[k] === fate[k + 1] && Number.isFinite(phi[k]) && Number.isFinite(phi[k + 1]);
    if (ok) {
      for (const s of [0.25, 0.5, 0.75]) {
        table.lookup((k + s) * h, rec);
        hermite(lut, k, s, test);
        const worst = Math.max(Math.abs(test[0] - rec.phi), Math.abs(test[2] - Math.cos(rec.phi)), Math.abs(test[3] - Math.sin(rec.phi)));
        if (rec.fate !== fate[k] || !(worst <= LUT_TOLERANCE_RAD)) ok = false;
      }
    }
    lut.binFate[k] = ok ? fate[k] : DEFER;
  }
  return lut;
}

/** Scratch of the lookupLensLut wrapper (one per module instance, i.e. per thread). */
const wrapIo = new Float64Array(8);

/**
 * Per-pixel lookup (fate, phi, g, dphi/dpsi; the Jacobian field is not filled).
 * @param lut grid
 * @param psi look angle from the outward radial axis, radians, 0..pi
 * @param cosPsi its cosine (the caller has it already)
 * @param out record written
 * @returns out
 */
export function lookupLensLut(lut: LensLut, psi: number, cosPsi: number, out: RayLookup): RayLookup {
  wrapIo[0] = psi;
  wrapIo[1] = cosPsi;
  lookupLensLutIo(lut, wrapIo, out);
  out.phi = wrapIo[4];
  out.dPhiDPsi = wrapIo[5];
  out.g = wrapIo[6];
  out.fate = wrapIo[7];
  return out;
}

/**
 * lookupLensLut for hot loops: inputs and results travel in a typed array, so the call neither boxes
 * numbers nor stores them into object fields (V8 may allocate a heap number for each such store).
 * @param lut grid
 * @param io in: [0] look angle psi from the outward radial axis, radians, 0..pi; [1] cos(psi).
 *   out: [2] cos(phi), [3] sin(phi), [4] phi, [5] dphi/dpsi, [6] g, [7] fate (8 entries or more)
 * @param scratch record used in bins that defer to the engine table
 */
export function lookupLensLutIo(lut: LensLut, io: Float64Array, scratch: RayLookup): void {
  const psi = io[0];
  const x = psi / BIN_RAD;
  let k = Math.floor(x);
  if (k >= LUT_BINS) k = LUT_BINS - 1;
  if (k < 0) k = 0;
  const fate = lut.binFate[k];
  if (fate === DEFER) {
    lut.table.lookup(psi, scratch);
    // the engine can return NaN exactly on a log-graded anchor: look a hair inside the bin instead
    if (!Number.isFinite(scratch.phi)) lut.table.lookup(x - k < 0.5 ? psi + LOOKUP_NUDGE_RAD : psi - LOOKUP_NUDGE_RAD, scratch);
    io[2] = Math.cos(scratch.phi);
    io[3] = Math.sin(scratch.phi);
    io[4] = scratch.phi;
    io[5] = scratch.dPhiDPsi;
    io[6] = scratch.g;
    io[7] = scratch.fate;
    return;
  }
  // cubic Hermite on the uniform grid, as hermite() above (inlined: its fractional argument would be boxed)
  const h = BIN_RAD;
  const s = x - k;
  const s2 = s * s;
  const s3 = s2 * s;
  const h00 = 2 * s3 - 3 * s2 + 1;
  const h10 = s3 - 2 * s2 + s;
  const h01 = -2 * s3 + 3 * s2;
  const h11 = s3 - s2;
  const m0 = lut.slope[k] * h;
  const m1 = lut.slope[k + 1] * h;
  const p0 = lut.phi[k];
  const p1 = lut.phi[k + 1];
  const c0 = lut.cosPhi[k];
  const c1 = lut.cosPhi[k + 1];
  const n0 = lut.sinPhi[k];
  const n1 = lut.sinPhi[k + 1];
  io[2] = h00 * c0 - h10 * n0 * m0 + h01 * c1 - h11 * n1 * m1;
  io[3] = h00 * n0 + h10 * c0 * m0 + h01 * n1 + h11 * c1 * m1;
  io[4] = h00 * p0 + h10 * m0 + h01 * p1 + h11 * m1;
  io[5] = ((6 * s2 - 6 * s) * p0 + (3 * s2 - 4 * s + 1) * m0 + (-6 * s2 + 6 * s) * p1 + (3 * s2 - 2 * s) * m1) / h;
  // g = 1 / |E / E_loc| with E / E_loc = eps - cos(psi) u^r (physics.md section 5)
  // (1 / |0| is Infinity, the horizon image; no `=== 0` test: a strict equality on a double makes V8 box it)
  io[6] = 1 / Math.abs(lut.eps - io[1] * lut.ur);
  io[7] = fate;
}

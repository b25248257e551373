/**
 * A faster front for the engine's per-frame ray table (lib/relativity
 * RayTable): a uniform grid over the look angle psi holding phi and dphi/dpsi
 * from the engine, interpolated by cubic Hermite. Every grid bin is checked
 * against the engine at its midpoint when built; bins where the fate changes
 * or the Hermite value misses the engine by more than LUT_TOLERANCE_RAD
 * (around the shadow edge, where phi diverges logarithmically, Bozza 2002)
 * hand the lookup to the engine table itself. So the per-pixel result always
 * agrees with the engine within the stated tolerance.
 */
import { createRayLookup, type RayLookup, type RayTable } from '../relativity';

/** Bins over 0..pi. */
const LUT_BINS = 8192;
/** Largest phi disagreement accepted at a bin midpoint before the bin defers to the engine, radians. */
export const LUT_TOLERANCE_RAD = 1e-7;

/** Uniform Hermite grid over psi with per-bin fallback to the engine. */
export interface LensLut {
  table: RayTable;
  /** phi at nodes k * pi / LUT_BINS */
  phi: Float64Array;
  /** dphi/dpsi at the nodes */
  slope: Float64Array;
  /** fate of each bin, or 255 when the bin defers to the engine */
  binFate: Uint8Array;
  /** eps and u^r of the reference observer, for g = 1 / |eps - u^r cos psi| (physics.md section 5) */
  eps: number;
  ur: number;
}

const DEFER = 255;

function hermite(lut: LensLut, k: number, s: number, h: number, out: RayLookup): void {
  const p0 = lut.phi[k];
  const p1 = lut.phi[k + 1];
  const m0 = lut.slope[k] * h;
  const m1 = lut.slope[k + 1] * h;
  const s2 = s * s;
  const s3 = s2 * s;
  out.phi = (2 * s3 - 3 * s2 + 1) * p0 + (s3 - 2 * s2 + s) * m0 + (-2 * s3 + 3 * s2) * p1 + (s3 - s2) * m1;
  out.dPhiDPsi = ((6 * s2 - 6 * s) * p0 + (3 * s2 - 4 * s + 1) * m0 + (-6 * s2 + 6 * s) * p1 + (3 * s2 - 2 * s) * m1) / h;
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
  const h = Math.PI / n;
  const phi = new Float64Array(n + 1);
  const slope = new Float64Array(n + 1);
  const fate = new Uint8Array(n + 1);
  const rec = createRayLookup();
  for (let k = 0; k <= n; k++) {
    table.lookup(k * h, rec);
    phi[k] = rec.phi;
    slope[k] = rec.dPhiDPsi;
    fate[k] = rec.fate;
  }
  const lut: LensLut = { table, phi, slope, binFate: new Uint8Array(n), eps, ur };
  const test = createRayLookup();
  for (let k = 0; k < n; k++) {
    let ok = fate[k] === fate[k + 1] && Number.isFinite(phi[k]) && Number.isFinite(phi[k + 1]);
    if (ok) {
      for (const s of [0.25, 0.5, 0.75]) {
        table.lookup((k + s) * h, rec);
        hermite(lut, k, s, h, test);
        if (rec.fate !== fate[k] || !(Math.abs(test.phi - rec.phi) <= LUT_TOLERANCE_RAD)) ok = false;
      }
    }
    lut.binFate[k] = ok ? fate[k] : DEFER;
  }
  return lut;
}

/**
 * Per-pixel lookup (fate, phi, g, dphi/dpsi; the Jacobian field is not filled).
 * @param lut grid
 * @param psi look angle from the outward radial axis, radians, 0..pi
 * @param cosPsi its cosine (the caller has it already)
 * @param out record written
 * @returns out
 */
export function lookupLensLut(lut: LensLut, psi: number, cosPsi: number, out: RayLookup): RayLookup {
  const x = (psi * LUT_BINS) / Math.PI;
  let k = Math.floor(x);
  if (k >= LUT_BINS) k = LUT_BINS - 1;
  if (k < 0) k = 0;
  const fate = lut.binFate[k];
  if (fate === DEFER) return lut.table.lookup(psi, out);
  hermite(lut, k, x - k, Math.PI / LUT_BINS, out);
  out.fate = fate;
  const energy = lut.eps - cosPsi * lut.ur;
  out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
  return out;
}

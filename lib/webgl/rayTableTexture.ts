/**
 * The engine's per-frame ray table (lib/relativity RayTable) packed for the
 * GPU: the segment layout as two vec4 uniform arrays and the node values
 * as a float texture whose texel i holds node i and node i + 1 (phi, dphi/dt
 * each), so the shader's cubic step reads one texel instead of two. The fragment shader
 * (shaders/sky.common.glsl, lookupRayTable) repeats RayTable.lookup on these
 * arrays, so the GPU and the CPU read the same table.
 *
 * The layout format is documented on RayTableArrays: a header of
 * RAY_TABLE_HEADER_LENGTH numbers (r, eps, u^r, segment count, psi of the shadow
 * edge, psi of the horizon image) and RAY_TABLE_SEGMENT_STRIDE numbers per
 * segment (map, psiLo, psiHi, anchor, t0, dt, offset, count, fate). Packing
 * checks that format and throws if it ever changes, so a silent mismatch
 * between engine and shader cannot happen.
 */
import type { RayTableArrays } from '../relativity';
import { ARRAY_TEXTURE_WIDTH, arrayTextureRows } from './arrayTexture';

/** Header length of RayTableArrays.layout (lib/relativity/rayTable.ts). */
export const RAY_TABLE_HEADER_LENGTH = 6;
/** Numbers per segment in RayTableArrays.layout (lib/relativity/rayTable.ts). */
export const RAY_TABLE_SEGMENT_STRIDE = 9;
/** Largest segment count the shader's uniform arrays hold (the engine makes at most 8). */
export const MAX_RAY_TABLE_SEGMENTS = 12;

/** Upper bound written for segments without one (the last in use, and unused slots), radians. */
export const SEGMENT_BOUND_NONE = 1e30;

/** Sampling maps of a segment: uniform in psi, log of the distance from the left or right anchor. */
export const MAP_UNIFORM = 0;
export const MAP_LOG_FROM_LEFT = 1;
export const MAP_LOG_TO_RIGHT = 2;

/** A ray table in GPU form. */
export interface PackedRayTable {
  /** reference observer's -u_t and u^r */
  eps: number;
  ur: number;
  segmentCount: number;
  /**
   * upper psi bound of each segment (rad), MAX_RAY_TABLE_SEGMENTS floats; SEGMENT_BOUND_NONE for the last
   * segment in use and the unused ones, so the segment of psi is the number of bounds below it
   */
  segmentHi: Float32Array;
  /** per segment (map, psiHi rad, anchor rad, fate), MAX_RAY_TABLE_SEGMENTS * 4 floats */
  segmentA: Float32Array;
  /** per segment (t0, dt, node offset, node count), MAX_RAY_TABLE_SEGMENTS * 4 floats */
  segmentB: Float32Array;
  /** node texture, 4 floats per texel (phi rad, dphi/dt of node i, then of node i + 1), ARRAY_TEXTURE_WIDTH wide */
  nodes: Float32Array;
  textureWidth: number;
  textureHeight: number;
}

/**
 * Packs a ray table for the shader.
 * @param arrays the engine's table (RayTable.toArrays or lib/render engineRayTableArrays)
 * @param reuse optional earlier result whose buffers are reused when large enough (no per-frame allocation)
 * @returns the packed table
 * @throws RangeError if the layout does not have the documented format
 */
export function packRayTable(arrays: RayTableArrays, reuse?: PackedRayTable): PackedRayTable {
  const L = arrays.layout;
  if (!(L instanceof Float64Array) || L.length < RAY_TABLE_HEADER_LENGTH) throw new RangeError('arrays.layout: the Float64Array of RayTable.toArrays');
  const count = L[3];
  if (!Number.isInteger(count) || count < 1 || count > MAX_RAY_TABLE_SEGMENTS || L.length !== RAY_TABLE_HEADER_LENGTH + RAY_TABLE_SEGMENT_STRIDE * count) {
    throw new RangeError(`arrays.layout: expected ${RAY_TABLE_HEADER_LENGTH} + ${RAY_TABLE_SEGMENT_STRIDE} x (1..${MAX_RAY_TABLE_SEGMENTS}) numbers (RayTable format changed?)`);
  }
  const total = arrays.phi.length;
  if (arrays.slope.length !== total) throw new RangeError('arrays.slope: must have as many nodes as arrays.phi');
  const height = arrayTextureRows(total);
  const out: PackedRayTable =
    reuse && reuse.nodes.length >= height * ARRAY_TEXTURE_WIDTH * 4 && reuse.textureHeight === height
      ? reuse
      : {
          eps: 0,
          ur: 0,
          segmentCount: 0,
          segmentHi: new Float32Array(MAX_RAY_TABLE_SEGMENTS),
          segmentA: new Float32Array(MAX_RAY_TABLE_SEGMENTS * 4),
          segmentB: new Float32Array(MAX_RAY_TABLE_SEGMENTS * 4),
          nodes: new Float32Array(height * ARRAY_TEXTURE_WIDTH * 4),
          textureWidth: ARRAY_TEXTURE_WIDTH,
          textureHeight: height,
        };
  out.eps = L[1];
  out.ur = L[2];
  out.segmentCount = count;
  out.segmentHi.fill(SEGMENT_BOUND_NONE);
  out.segmentA.fill(0);
  out.segmentB.fill(0);
  for (let k = 0; k < count; k++) {
    const s = RAY_TABLE_HEADER_LENGTH + RAY_TABLE_SEGMENT_STRIDE * k;
    const map = L[s];
    const offset = L[s + 6];
    const n = L[s + 7];
    if ((map !== MAP_UNIFORM && map !== MAP_LOG_FROM_LEFT && map !== MAP_LOG_TO_RIGHT) || !(n >= 2) || offset + n > total) {
      throw new RangeError(`arrays.layout: segment ${k} is not a (map, lo, hi, anchor, t0, dt, offset, count, fate) record`);
    }
    if (k < count - 1) out.segmentHi[k] = L[s + 2];
    out.segmentA.set([map, L[s + 2], L[s + 3], L[s + 8]], 4 * k);
    out.segmentB.set([L[s + 4], L[s + 5], offset, n], 4 * k);
  }
  const nodes = out.nodes;
  for (let i = 0; i < total; i++) {
    const next = Math.min(i + 1, total - 1);
    nodes[4 * i] = arrays.phi[i];
    nodes[4 * i + 1] = arrays.slope[i];
    nodes[4 * i + 2] = arrays.phi[next];
    nodes[4 * i + 3] = arrays.slope[next];
  }
  return out;
}

/** Result record of {@link lookupPackedRayTable}. */
export interface PackedLookup {
  fate: number;
  phi: number;
  dPhiDPsi: number;
  g: number;
}

const f32 = Math.fround;

/**
 * The segment of a packed table holding look angle psi, by the shader's rule: the number of upper bounds below
 * psi (the bounds rise; the last segment's and unused slots' are SEGMENT_BOUND_NONE).
 * @param table packed table
 * @param psi look angle, radians
 */
export function packedSegmentOf(table: PackedRayTable, psi: number): number {
  let seg = 0;
  for (let k = 0; k < MAX_RAY_TABLE_SEGMENTS; k++) if (psi > table.segmentHi[k]) seg++;
  return seg;
}

/**
 * The shader's lookupRayTable in TypeScript with float32 rounding at the same
 * places, for tests of the GPU path without a GPU (mirrors lib/relativity
 * RayTable.lookup).
 * @param table packed table
 * @param psi look angle from the outward radial axis, radians, [0, pi]
 * @param out record written
 * @returns out
 * @throws RangeError for psi outside [0, pi]
 */
export function lookupPackedRayTable(table: PackedRayTable, psi: number, out: PackedLookup): PackedLookup {
  if (!(psi >= 0 && psi <= Math.PI)) throw new RangeError(`psi must be in [0, pi] radians; got ${psi}`);
  const p = f32(psi);
  const A = table.segmentA;
  const B = table.segmentB;
  const seg = packedSegmentOf(table, p);
  const map = A[4 * seg];
  const anchor = A[4 * seg + 2];
  const t0 = B[4 * seg];
  const dt = B[4 * seg + 1];
  const offset = B[4 * seg + 2];
  const n = B[4 * seg + 3];
  let t: number;
  let dtDpsi: number;
  if (map === MAP_UNIFORM) {
    t = p;
    dtDpsi = 1;
  } else {
    const d = Math.max(f32(map === MAP_LOG_FROM_LEFT ? p - anchor : anchor - p), 1e-30);
    t = f32(Math.log(d));
    dtDpsi = (map === MAP_LOG_FROM_LEFT ? 1 : -1) / d;
  }
  const x = f32((t - t0) / dt);
  const nodes = table.nodes;
  let phi: number;
  let dPhiDt: number;
  if (x <= 0) {
    phi = nodes[4 * offset] + nodes[4 * offset + 1] * (t - t0);
    dPhiDt = nodes[4 * offset + 1];
  } else {
    const i = Math.min(Math.floor(x), n - 2);
    const s = x - i;
    const k = 4 * (offset + i);
    const p0 = nodes[k];
    const p1 = nodes[k + 2];
    const m0 = nodes[k + 1] * dt;
    const m1 = nodes[k + 3] * dt;
    const s2 = s * s;
    const s3 = s2 * s;
    phi = (2 * s3 - 3 * s2 + 1) * p0 + (s3 - 2 * s2 + s) * m0 + (-2 * s3 + 3 * s2) * p1 + (s3 - s2) * m1;
    dPhiDt = ((6 * s2 - 6 * s) * p0 + (3 * s2 - 4 * s + 1) * m0 + (-6 * s2 + 6 * s) * p1 + (3 * s2 - 2 * s) * m1) / dt;
  }
  const energy = f32(table.eps) - Math.cos(p) * f32(table.ur);
  out.fate = A[4 * seg + 3];
  out.phi = f32(phi);
  out.dPhiDPsi = f32(dPhiDt * dtDpsi);
  out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
  return out;
}

/**
 * "Where the light comes from" on the CPU: for each pixel, the direction on
 * the celestial sphere (or the point on the horizon) its light comes from,
 * and the celestial coordinate grid drawn through the lensing. Built only
 * from lib/render's exported pieces (FramePlan, lookupLensLut) plus gridCoverage.ts (lib/render's drawLensedGrid formula) and
 * following lib/render/shade.ts Shader.shade step by step, so that it can move
 * into lib/render as a render mode later. The GPU twin is
 * shaders/sky.directions.frag and the overlay in shaders/sky.lensed.frag.
 */
import type { FramePlan } from '../render/frame';
import type { RowBand } from '../render/renderRows';
import { lookupLensLut } from '../render/lensLut';
import { lensedGridCoverage } from './gridCoverage';
import { hexToLinear } from '../render/shade';
import { createRayLookup, FATE_SKY } from '../relativity';

/** Fate code written for pixels outside a dome's image circle. */
export const FATE_OUTSIDE = -1;

/** Celestial (RA/Dec) grid of the "where the light comes from" view: Skywell's own style. */
export const CELESTIAL_GRID = {
  /** 15 degrees = one hour of right ascension */
  spacingDeg: 15,
  lineWidthPx: 1,
  /** slate-200 of the interface palette */
  colour: '#d6dce6',
} as const;

/** Per-call scratch (allocation-free tracing). */
export interface SourceTracer {
  plan: FramePlan;
  view: Float64Array;
  cam: Float64Array;
  lens: ReturnType<typeof createRayLookup>;
}

/**
 * Scratch state for tracing pixels of one plan.
 * @param plan lib/render frame plan (prepareFrame)
 * @returns the tracer
 */
export function createSourceTracer(plan: FramePlan): SourceTracer {
  return { plan, view: new Float64Array(3), cam: new Float64Array(3), lens: createRayLookup() };
}

/** Length of the record written by {@link traceSourceDirection}. */
export const SOURCE_RECORD_LENGTH = 11;

/**
 * Where the light of one frame point comes from (lib/render Shader.shade, up to the sky direction).
 * @param tracer scratch from createSourceTracer
 * @param px frame x, pixels from the left edge (pixel centres at half-integers)
 * @param py frame y, pixels from the top edge
 * @param out SOURCE_RECORD_LENGTH floats written: [0..2] unit vector in the hole frame (J2000; sky
 *   direction, or the point where the backward ray meets r = 2M); [3..5] and [6..8] its change per
 *   output pixel along and across the look angle (the grid point of lensedGridCoverage);
 *   [9] fate (0 sky, 1 horizon, 2 far side, -1 outside the image); [10] the footprint on the sky, radians
 * @returns out
 */
export function traceSourceDirection(tracer: SourceTracer, px: number, py: number, out: Float64Array): Float64Array {
  const plan = tracer.plan;
  const pixelRad = plan.projector.pixelToView(tracer.view, px, py);
  if (pixelRad < 0) {
    out.fill(0);
    out[9] = FATE_OUTSIDE;
    return out;
  }
  const v = tracer.view;
  const m = plan.viewToCamera;
  let n1 = m[0] * v[0] + m[1] * v[1] + m[2] * v[2];
  let n2 = m[3] * v[0] + m[4] * v[1] + m[5] * v[2];
  let n3 = m[6] * v[0] + m[7] * v[1] + m[8] * v[2];
  let doppler = 1;
  if (plan.optics.boost && plan.req.effects.lensing) {
    doppler = plan.optics.boost(tracer.cam, n1, n2, n3);
    n1 = tracer.cam[0];
    n2 = tracer.cam[1];
    n3 = tracer.cam[2];
  }
  let sinPsi = Math.sqrt(n2 * n2 + n3 * n3);
  let t2 = 1;
  let t3 = 0;
  if (sinPsi > 1e-15) {
    t2 = n2 / sinPsi;
    t3 = n3 / sinPsi;
  } else {
    sinPsi = 0;
  }
  const psi = Math.atan2(sinPsi, n1);
  const ls = tracer.lens;
  if (plan.lens) {
    lookupLensLut(plan.lens, psi, n1, ls);
  } else {
    ls.fate = FATE_SKY;
    ls.phi = psi;
    ls.dPhiDPsi = 1;
  }
  const cp = Math.cos(ls.phi);
  const sp = Math.sin(ls.phi);
  const c = plan.cameraToHole;
  // e1 and the transverse look direction t in the hole frame; d = cos(phi) e1 + sin(phi) t
  const tx = c[1] * t2 + c[2] * t3;
  const ty = c[4] * t2 + c[5] * t3;
  const tz = c[7] * t2 + c[8] * t3;
  out[0] = cp * c[0] + sp * tx;
  out[1] = cp * c[3] + sp * ty;
  out[2] = cp * c[6] + sp * tz;
  // aberration is conformal with scale D (Einstein 1905): a camera pixel spans D times its angle
  const pixelRefRad = pixelRad * doppler;
  const radialRate = ls.dPhiDPsi;
  const tangentialRate = sinPsi > 1e-9 ? sp / sinPsi : radialRate;
  const a = radialRate * pixelRefRad;
  const b = tangentialRate * pixelRefRad;
  out[3] = a * (cp * tx - sp * c[0]);
  out[4] = a * (cp * ty - sp * c[3]);
  out[5] = a * (cp * tz - sp * c[6]);
  // e1 x t = cameraToHole (0, -t3, t2)
  out[6] = b * (c[2] * t2 - c[1] * t3);
  out[7] = b * (c[5] * t2 - c[4] * t3);
  out[8] = b * (c[8] * t2 - c[7] * t3);
  out[9] = ls.fate;
  out[10] = pixelRefRad * Math.max(Math.abs(radialRate), Math.abs(tangentialRate));
  return out;
}

/**
 * Source directions of every pixel centre of a frame.
 * @param plan lib/render frame plan
 * @returns 5 floats per pixel, row-major from the top-left: hole-frame unit vector, fate, footprint (rad)
 */
export function renderSourceDirections(plan: FramePlan): Float64Array {
  const { width, height } = plan.req;
  const out = new Float64Array(width * height * 5);
  const tracer = createSourceTracer(plan);
  const rec = new Float64Array(SOURCE_RECORD_LENGTH);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      traceSourceDirection(tracer, x + 0.5, y + 0.5, rec);
      const o = (y * width + x) * 5;
      out[o] = rec[0];
      out[o + 1] = rec[1];
      out[o + 2] = rec[2];
      out[o + 3] = rec[9];
      out[o + 4] = rec[10];
    }
  }
  return out;
}

/**
 * Draw the celestial grid through the lensing over a band that lib/render's
 * renderBandLinear produced (display-linear RGB), compositing like its overlays.
 * @param plan lib/render frame plan
 * @param band rows of the band
 * @param linear 3 floats per pixel of the band, modified in place
 * @returns linear
 * @throws RangeError if the buffer does not match the band
 */
export function compositeCelestialGrid(plan: FramePlan, band: RowBand, linear: Float32Array): Float32Array {
  const width = plan.req.width;
  if (linear.length !== (band.y1 - band.y0) * width * 3) throw new RangeError('linear: length must be rows * width * 3');
  const n = plan.req.supersampling;
  const colour = hexToLinear(CELESTIAL_GRID.colour);
  const tracer = createSourceTracer(plan);
  const rec = new Float64Array(SOURCE_RECORD_LENGTH);
  for (let y = band.y0; y < band.y1; y++) {
    for (let x = 0; x < width; x++) {
      let cover = 0;
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          traceSourceDirection(tracer, x + (sx + 0.5) / n, y + (sy + 0.5) / n, rec);
          if (rec[9] === FATE_SKY) cover += lensedGridCoverage(rec, CELESTIAL_GRID.spacingDeg, CELESTIAL_GRID.lineWidthPx, 1 / n);
        }
      }
      const a = cover / (n * n);
      if (a > 0) {
        const i = ((y - band.y0) * width + x) * 3;
        linear[i] = linear[i] * (1 - a) + colour[0] * a;
        linear[i + 1] = linear[i + 1] * (1 - a) + colour[1] * a;
        linear[i + 2] = linear[i + 2] * (1 - a) + colour[2] * a;
      }
    }
  }
  return linear;
}

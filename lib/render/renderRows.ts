/**
 * Render a band of rows of a frame: supersampling, exposure, tone mapping,
 * overlay compositing, and optional 8/16-bit sRGB encoding. Every pixel depends
 * only on the plan and its own position, so any split into bands, tiles or
 * threads gives the same values.
 */
import type { FramePlan } from './frame';
import { Shader } from './shade';
import { srgbEncode16, srgbEncode8, toneMapInPlace } from './toneMap';

/** Band of rows [y0, y1) of the full frame. */
export interface RowBand {
  y0: number;
  y1: number;
}

function checkBand(plan: FramePlan, band: RowBand): void {
  const { y0, y1 } = band;
  if (!Number.isInteger(y0) || !Number.isInteger(y1) || y0 < 0 || y1 > plan.req.height || y1 <= y0) {
    throw new RangeError(`band: integer rows with 0 <= y0 < y1 <= ${plan.req.height}`);
  }
}

/**
 * Display-linear RGB of a band (exposure and tone mapping applied, overlays composited).
 * With toneMap 'none' and exposure scale s, the values are radiance * s plus overlays.
 * @param plan frame plan
 * @param band rows to render
 * @param out optional output, 3 floats per pixel, (y1 - y0) * width * 3 long
 * @returns out
 */
export function renderBandLinear(plan: FramePlan, band: RowBand, out?: Float32Array): Float32Array {
  checkBand(plan, band);
  const width = plan.req.width;
  const rows = band.y1 - band.y0;
  const buf = out ?? new Float32Array(rows * width * 3);
  if (buf.length !== rows * width * 3) throw new RangeError('out: length must be rows * width * 3');
  const shader = new Shader(plan);
  const n = plan.req.supersampling;
  const inv = 1 / (n * n);
  const scale = plan.exposure;
  const op = plan.req.exposure.toneMap;
  const acc = new Float64Array(7);
  for (let y = band.y0; y < band.y1; y++) {
    for (let x = 0; x < width; x++) {
      acc.fill(0);
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          const res = shader.shade(x + (sx + 0.5) / n, y + (sy + 0.5) / n, n);
          acc[0] += res.radiance[0];
          acc[1] += res.radiance[1];
          acc[2] += res.radiance[2];
          acc[3] += res.overlay[0];
          acc[4] += res.overlay[1];
          acc[5] += res.overlay[2];
          acc[6] += res.overlay[3];
        }
      }
      const i = ((y - band.y0) * width + x) * 3;
      buf[i] = acc[0] * inv * scale;
      buf[i + 1] = acc[1] * inv * scale;
      buf[i + 2] = acc[2] * inv * scale;
      toneMapInPlace(buf, i, op);
      const a = acc[6] * inv;
      if (a > 0) {
        buf[i] = buf[i] * (1 - a) + acc[3] * inv;
        buf[i + 1] = buf[i + 1] * (1 - a) + acc[4] * inv;
        buf[i + 2] = buf[i + 2] * (1 - a) + acc[5] * inv;
      }
    }
  }
  return buf;
}

/**
 * Encoded sRGB samples of a band, 3 per pixel.
 * @param plan frame plan
 * @param band rows to render
 * @param bitDepth 8 or 16
 * @returns Uint8Array or Uint16Array, (y1 - y0) * width * 3 long
 */
export function renderBandEncoded(plan: FramePlan, band: RowBand, bitDepth: 8 | 16): Uint8Array | Uint16Array {
  if (bitDepth !== 8 && bitDepth !== 16) throw new RangeError('bitDepth: 8 or 16');
  const linear = renderBandLinear(plan, band);
  const out = bitDepth === 8 ? new Uint8Array(linear.length) : new Uint16Array(linear.length);
  const enc = bitDepth === 8 ? srgbEncode8 : srgbEncode16;
  for (let i = 0; i < linear.length; i++) out[i] = enc(linear[i]);
  return out;
}

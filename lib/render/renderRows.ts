/**
 * Render rows of a frame: supersampling, exposure, tone mapping, overlay
 * compositing, and optional 8/16-bit sRGB encoding. Every pixel depends only
 * on the plan and its own position, so any split into bands, tiles or
 * threads gives the same values.
 */
import type { FramePlan } from './frame';
import { Shader, type RayTracer } from './shade';
import { srgbEncode16, srgbLut8 } from './toneMap';

/** Band of rows [y0, y1) of the full frame. */
export interface RowBand {
  y0: number;
  y1: number;
}

const encode16 = srgbEncode16;

function checkBand(plan: FramePlan, band: RowBand): void {
  const { y0, y1 } = band;
  if (!Number.isInteger(y0) || !Number.isInteger(y1) || y0 < 0 || y1 > plan.req.height || y1 <= y0) {
    throw new RangeError(`band: integer rows with 0 <= y0 < y1 <= ${plan.req.height}`);
  }
}

/**
 * Shades whole rows of one frame into display-linear RGB (exposure, tone
 * mapping and overlays applied). One per thread; reuses its scratch memory.
 */
export class RowRenderer {
  private readonly shader: Shader;
  private readonly width: number;

  /**
   * @param plan frame plan
   * @param tracer ray tracer replacing the lensing table (brute force), or null for the table
   */
  constructor(
    private readonly plan: FramePlan,
    tracer: RayTracer | null = null,
  ) {
    this.shader = new Shader(plan, tracer);
    this.width = plan.req.width;
  }

  /**
   * Display-linear RGB of one row.
   * @param y row index, 0 at the top (integer, 0..height-1)
   * @param out receives 3 floats per pixel from `offset`
   * @param offset index of the row's first float in out
   * @param x0 first column (default 0)
   * @param x1 one past the last column (default: the frame width)
   */
  renderRow(y: number, out: Float32Array, offset: number, x0 = 0, x1 = this.width): void {
    if (!Number.isInteger(y) || y < 0 || y >= this.plan.req.height) throw new RangeError(`y: integer row 0..${this.plan.req.height - 1}`);
    if (!Number.isInteger(x0) || !Number.isInteger(x1) || x0 < 0 || x1 > this.width || x1 < x0) {
      throw new RangeError(`x0, x1: integer columns with 0 <= x0 <= x1 <= ${this.width}`);
    }
    if (!Number.isInteger(offset) || offset < 0 || offset + (x1 - x0) * 3 > out.length) throw new RangeError('offset: the row must fit in out');
    // the per-pixel work lives in a per-pixel method: V8 optimizes it by call count, whereas a long
    // loop here may be left in its baseline tier after an early deoptimization (seen: frames 4x slower)
    const shader = this.shader;
    let o = offset;
    for (let x = x0; x < x1; x++) {
      shader.shadePixel(x, y, out, o);
      o += 3;
    }
  }
}

/**
 * Display-linear RGB of a band (exposure and tone mapping applied, overlays composited).
 * With toneMap 'none' and exposure scale s, the values are radiance * s plus overlays.
 * @param plan frame plan
 * @param band rows to render
 * @param out optional output, 3 floats per pixel, (y1 - y0) * width * 3 long
 * @param tracer ray tracer replacing the lensing table (brute force), or null for the table
 * @returns out
 */
export function renderBandLinear(plan: FramePlan, band: RowBand, out?: Float32Array, tracer: RayTracer | null = null): Float32Array {
  checkBand(plan, band);
  const width = plan.req.width;
  const rows = band.y1 - band.y0;
  const buf = out ?? new Float32Array(rows * width * 3);
  if (buf.length !== rows * width * 3) throw new RangeError('out: length must be rows * width * 3');
  const renderer = new RowRenderer(plan, tracer);
  for (let y = band.y0; y < band.y1; y++) renderer.renderRow(y, buf, (y - band.y0) * width * 3);
  return buf;
}

/**
 * Encode display-linear values as sRGB codes (IEC 61966-2-1), clipped to 0..1.
 * @param linear source values
 * @param from first index in linear
 * @param count number of values
 * @param out Uint8Array for 8-bit codes, Uint16Array for 16-bit codes
 * @param at first index written in out
 */
export function encodeSrgbInto(linear: Float32Array, from: number, count: number, out: Uint8Array | Uint16Array, at: number): void {
  if (!Number.isInteger(from) || !Number.isInteger(count) || !Number.isInteger(at) || from < 0 || count < 0 || at < 0) {
    throw new RangeError('from, count, at: integers >= 0');
  }
  if (from + count > linear.length || at + count > out.length) throw new RangeError('count: the values must fit in linear and out');
  if (out instanceof Uint8Array) {
    const lut = srgbLut8();
    for (let i = 0; i < count; i++) {
      const v = linear[from + i];
      out[at + i] = !(v > 0) ? 0 : v >= 1 ? 255 : lut[Math.round(v * 65535)];
    }
    return;
  }
  for (let i = 0; i < count; i++) out[at + i] = encode16(linear[from + i]);
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
  checkBand(plan, band);
  const width = plan.req.width;
  const out = bitDepth === 8 ? new Uint8Array((band.y1 - band.y0) * width * 3) : new Uint16Array((band.y1 - band.y0) * width * 3);
  const row = new Float32Array(width * 3);
  const renderer = new RowRenderer(plan);
  for (let y = band.y0; y < band.y1; y++) {
    renderer.renderRow(y, row, 0);
    encodeSrgbInto(row, 0, row.length, out, (y - band.y0) * width * 3);
  }
  return out;
}

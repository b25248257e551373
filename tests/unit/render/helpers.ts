/** Shared helpers of the render tests. */
import { parseFrameRequest, type FrameRequestInput } from '@/lib/render/schema';
import { prepareFrame, type SkyAssets } from '@/lib/render/frame';
import { renderBandLinear } from '@/lib/render/renderRows';
import type { StarCatalogue } from '@/lib/render/starCatalogue';

/** |a - b| <= tol, reported with both values when it fails. */
export function close(a: number, b: number, tol: number): boolean {
  return Math.abs(a - b) <= tol;
}

/** Ev that makes the exposure scale exactly 1 (2^ev / 1000 = 1), so 'none' tone mapping returns radiance. */
export const UNIT_EXPOSURE_EV = Math.log2(1000);

/** A one-star (or few-star) catalogue. */
export function syntheticCatalogue(stars: { raDeg: number; decDeg: number; mag: number; bv?: number }[]): StarCatalogue {
  const n = stars.length;
  return {
    count: n,
    hip: Int32Array.from(stars.map((_, i) => i + 1)),
    raDeg: Float32Array.from(stars.map((s) => s.raDeg)),
    decDeg: Float32Array.from(stars.map((s) => s.decDeg)),
    mag: Float32Array.from(stars.map((s) => s.mag)),
    bv: Float32Array.from(stars.map((s) => s.bv ?? 0.65)),
  };
}

/** Render rows [y0, y1) of a request to display-linear floats (3 per pixel). */
export function renderRowsLinear(input: FrameRequestInput, assets: SkyAssets, y0 = 0, y1?: number): Float32Array {
  const req = parseFrameRequest(input);
  const plan = prepareFrame(req, assets);
  return renderBandLinear(plan, { y0, y1: y1 ?? req.height });
}

/** Rec. 709 luminance of pixel i of an RGB float buffer. */
export function luminance(buf: Float32Array, i: number): number {
  return 0.2126 * buf[3 * i] + 0.7152 * buf[3 * i + 1] + 0.0722 * buf[3 * i + 2];
}

/** Settings that switch off everything but what a test puts in. */
export const BARE = {
  sky: {
    stars: { enabled: false },
    milkyWay: { enabled: false },
  },
  effects: {
    horizonGrid: { enabled: false },
    farSideGrid: { enabled: false },
  },
  exposure: { ev: UNIT_EXPOSURE_EV, toneMap: 'none' as const },
};

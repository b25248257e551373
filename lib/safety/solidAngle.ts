/**
 * Solid angle of one frame pixel as seen from the projection centre (for a
 * dome master: the dome's centre seat), from the renderer's own projector so
 * that areas match the rendered directions exactly.
 */
import type { Projector } from '../render/projections';

/** Finite-difference step in pixels: small against a pixel, large against double rounding (directions ~1, steps ~1e-6 rad). */
const STEP_PX = 1 / 256;

/** Scratch vectors for pixelSolidAngleSr, so the per-pixel path allocates nothing. */
export interface SolidAngleScratch {
  centre: Float64Array;
  alongX: Float64Array;
  alongY: Float64Array;
}

/** Fresh scratch vectors for pixelSolidAngleSr. */
export function createSolidAngleScratch(): SolidAngleScratch {
  return { centre: new Float64Array(3), alongX: new Float64Array(3), alongY: new Float64Array(3) };
}

/**
 * Solid angle of the pixel whose centre is (px, py): the Jacobian |dd/dx x dd/dy| of
 * the unit view direction d over the frame, times one square pixel (midpoint rule;
 * the relative error is of order (pixel angle)^2, under 1e-4 for pixels under 1 degree).
 * A one-sided difference is taken inward at the rim of a dome's image circle.
 * @param projector the renderer's projector (lib/render/projections.ts)
 * @param px pixel centre, px from the left edge (x + 0.5)
 * @param py pixel centre, px from the top edge (y + 0.5)
 * @param scratch vectors from createSolidAngleScratch; scratch.centre receives the view direction
 * @returns steradians; 0 when the pixel centre lies outside the image (dome rim, corners)
 */
export function pixelSolidAngleSr(projector: Projector, px: number, py: number, scratch: SolidAngleScratch): number {
  const c = scratch.centre;
  const a = scratch.alongX;
  const b = scratch.alongY;
  if (projector.pixelToView(c, px, py) < 0) return 0;
  let hx = STEP_PX;
  if (projector.pixelToView(a, px + hx, py) < 0) {
    hx = -STEP_PX;
    if (projector.pixelToView(a, px + hx, py) < 0) return 0;
  }
  let hy = STEP_PX;
  if (projector.pixelToView(b, px, py + hy) < 0) {
    hy = -STEP_PX;
    if (projector.pixelToView(b, px, py + hy) < 0) return 0;
  }
  const ax = (a[0] - c[0]) / hx, ay = (a[1] - c[1]) / hx, az = (a[2] - c[2]) / hx;
  const bx = (b[0] - c[0]) / hy, by = (b[1] - c[1]) / hy, bz = (b[2] - c[2]) / hy;
  const cx = ay * bz - az * by;
  const cy = az * bx - ax * bz;
  const cz = ax * by - ay * bx;
  return Math.sqrt(cx * cx + cy * cy + cz * cz);
}

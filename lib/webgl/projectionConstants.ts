/**
 * Projection constants for the shader's pixelToView (shaders/sky.common.glsl),
 * which mirrors lib/render/projections.ts createProjector: flat (rectilinear,
 * horizontal field of view), dome master (azimuthal equidistant fisheye),
 * equirectangular 360 x 180, and one 90-degree cube face (physics.md section 7).
 */
import type { Projection } from '../render/schema';
import { CUBE_FACES } from '../render/projections';

/** Projection codes of the shader (its PROJECTION switch, lib/webgl/shaderVariant.ts). */
export const PROJECTION_CODES = { flat: 0, dome: 1, equirect: 2, cubeFace: 3 } as const;

const DEG = Math.PI / 180;


/** Uniforms of one projection. */
export interface ProjectionConstants {
  kind: number;
  width: number;
  height: number;
  /** flat and cube face: focal length, px */
  focalPx: number;
  /** dome: radians per pixel from the centre */
  radPerPx: number;
  /** dome: half the aperture, radians */
  halfApertureRad: number;
  /** cube face: row-major 3x3 with columns right, top, centre (front-face view space) */
  cubeFace: Float64Array;
}

/**
 * Constants of a projection for a frame size.
 * @param projection validated projection (degrees)
 * @param width frame width, px (1..8192)
 * @param height frame height, px (1..8192); dome and cube faces are square
 * @returns the constants
 * @throws RangeError for bad sizes or non-square dome and cube frames
 */
export function projectionConstants(projection: Projection, width: number, height: number): ProjectionConstants {
  if (!Number.isInteger(width) || width < 1 || width > 8192) throw new RangeError('width: integer 1..8192 px');
  if (!Number.isInteger(height) || height < 1 || height > 8192) throw new RangeError('height: integer 1..8192 px');
  const out: ProjectionConstants = {
    kind: PROJECTION_CODES[projection.kind],
    width,
    height,
    focalPx: 1,
    radPerPx: 0,
    halfApertureRad: 0,
    cubeFace: new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 1]),
  };
  if (projection.kind === 'flat') {
    out.focalPx = width / 2 / Math.tan((projection.fovDeg * DEG) / 2);
  } else if (projection.kind === 'dome') {
    if (width !== height) throw new RangeError('height: must equal width for a dome master');
    out.halfApertureRad = (projection.apertureDeg * DEG) / 2;
    out.radPerPx = out.halfApertureRad / (width / 2);
  } else if (projection.kind === 'cubeFace') {
    if (width !== height) throw new RangeError('height: must equal width for a cube face');
    out.focalPx = width / 2; // 90-degree face: tan(45 deg) = 1
    const [c, t] = CUBE_FACES[projection.face];
    // right = top x centre (the drawn left-handed view convention of lib/render)
    const r = [t[1] * c[2] - t[2] * c[1], t[2] * c[0] - t[0] * c[2], t[0] * c[1] - t[1] * c[0]];
    out.cubeFace = new Float64Array([r[0], t[0], c[0], r[1], t[1], c[1], r[2], t[2], c[2]]);
  }
  return out;
}

/**
 * The shader's pixelToView in TypeScript (for tests without a GPU).
 * @param out unit view direction written (x right, y up, z frame centre)
 * @param k projection constants
 * @param px frame x, pixels from the left edge
 * @param py frame y, pixels from the top edge
 * @returns the pixel's angular size in radians, or -1 outside a dome's image circle
 */
export function pixelToViewMirror(out: Float64Array, k: ProjectionConstants, px: number, py: number): number {
  if (k.kind === PROJECTION_CODES.dome) {
    const dx = px - k.width / 2;
    const dy = k.height / 2 - py;
    const rho = Math.hypot(dx, dy);
    const theta = rho * k.radPerPx;
    if (theta > k.halfApertureRad) return -1;
    const s = rho > 0 ? Math.sin(theta) / rho : 0;
    out[0] = dx * s;
    out[1] = dy * s;
    out[2] = Math.cos(theta);
    return k.radPerPx;
  }
  if (k.kind === PROJECTION_CODES.equirect) {
    const lon = (px / k.width - 0.5) * 2 * Math.PI;
    const lat = (0.5 - py / k.height) * Math.PI;
    const c = Math.cos(lat);
    out[0] = c * Math.sin(lon);
    out[1] = Math.sin(lat);
    out[2] = c * Math.cos(lon);
    return Math.max((2 * Math.PI * c) / k.width, Math.PI / k.height);
  }
  const x = (px - k.width / 2) / k.focalPx;
  const y = (k.height / 2 - py) / k.focalPx;
  const inv = 1 / Math.sqrt(x * x + y * y + 1);
  const m = k.cubeFace;
  const vx = x * inv;
  const vy = y * inv;
  out[0] = m[0] * vx + m[1] * vy + m[2] * inv;
  out[1] = m[3] * vx + m[4] * vy + m[5] * inv;
  out[2] = m[6] * vx + m[7] * vy + m[8] * inv;
  return inv / k.focalPx;
}

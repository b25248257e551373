/**
 * Projections between frame pixels and view directions (physics.md section 7).
 *
 * View space: x to the right of the frame, y to its top, z through its centre
 * (a left-handed triple as drawn; orientation.ts maps it to the right-handed
 * camera frame with right = centre x top). Pixel (0, 0) is the top-left
 * corner of the frame; pixel centres sit at half-integers.
 */
import type { Projection } from './schema';

const DEG = Math.PI / 180;

/** Maps pixels to unit view directions and back for one projection and frame size. */
export interface Projector {
  /**
   * View direction through frame point (px, py), in pixels from the top-left corner.
   * @param out receives the unit view direction (x right, y up, z centre)
   * @returns the pixel's angular size in radians (the larger of its two axes), or -1 outside the image circle
   */
  pixelToView(out: Float64Array, px: number, py: number): number;
  /**
   * pixelToView for hot loops: no number crosses the call (V8 boxes doubles passed to or
   * returned from calls it does not inline, which allocates per pixel).
   * @param io in: [0] px, [1] py (pixels from the top-left corner); out: [2], [3], [4] the unit view
   *   direction, [5] the pixel's angular size in radians, or -1 outside the image circle
   */
  project(io: Float64Array): void;
  /**
   * Frame point of a view direction.
   * @param out receives [px, py] in pixels from the top-left corner
   * @returns false if the direction is not in the frame's field
   */
  viewToPixel(out: Float64Array, x: number, y: number, z: number): boolean;
}

/** Scratch of the pixelToView wrappers (one per module instance, i.e. per thread). */
const wrapIo = new Float64Array(6);

/** pixelToView in terms of project: one implementation of each projection's formulas. */
function pixelToViewVia(projector: Projector, out: Float64Array, px: number, py: number): number {
  wrapIo[0] = px;
  wrapIo[1] = py;
  projector.project(wrapIo);
  out[0] = wrapIo[2];
  out[1] = wrapIo[3];
  out[2] = wrapIo[4];
  return wrapIo[5];
}

/** Rectilinear (pinhole) projection with a horizontal field of view. */
class FlatProjector implements Projector {
  private readonly focalPx: number;
  constructor(
    private readonly width: number,
    private readonly height: number,
    fovDeg: number,
  ) {
    this.focalPx = width / 2 / Math.tan((fovDeg * DEG) / 2);
  }
  pixelToView(out: Float64Array, px: number, py: number): number {
    return pixelToViewVia(this, out, px, py);
  }
  project(io: Float64Array): void {
    const x = (io[0] - this.width / 2) / this.focalPx;
    const y = (this.height / 2 - io[1]) / this.focalPx;
    const inv = 1 / Math.sqrt(x * x + y * y + 1);
    io[2] = x * inv;
    io[3] = y * inv;
    io[4] = inv;
    // tangential pixel size = cos(theta) / f; the radial one is smaller (cos^2 / f)
    io[5] = inv / this.focalPx;
  }
  viewToPixel(out: Float64Array, x: number, y: number, z: number): boolean {
    if (!(z > 0)) return false;
    out[0] = this.width / 2 + (this.focalPx * x) / z;
    out[1] = this.height / 2 - (this.focalPx * y) / z;
    return true;
  }
}

/**
 * Dome master: azimuthal equidistant fisheye in a square frame, angle from the
 * centre proportional to distance from the frame centre; the aperture spans the
 * frame width (fulldome trade convention, physics.md section 7).
 */
class DomeProjector implements Projector {
  private readonly radPerPx: number;
  private readonly halfApertureRad: number;
  constructor(
    private readonly size: number,
    apertureDeg: number,
  ) {
    this.halfApertureRad = (apertureDeg * DEG) / 2;
    this.radPerPx = this.halfApertureRad / (size / 2);
  }
  pixelToView(out: Float64Array, px: number, py: number): number {
    return pixelToViewVia(this, out, px, py);
  }
  project(io: Float64Array): void {
    const dx = io[0] - this.size / 2;
    const dy = this.size / 2 - io[1];
    const rho = Math.sqrt(dx * dx + dy * dy);
    const theta = rho * this.radPerPx;
    if (theta > this.halfApertureRad) {
      io[5] = -1;
      return;
    }
    const s = rho > 0 ? Math.sin(theta) / rho : 0;
    io[2] = dx * s;
    io[3] = dy * s;
    io[4] = Math.cos(theta);
    io[5] = this.radPerPx;
  }
  viewToPixel(out: Float64Array, x: number, y: number, z: number): boolean {
    const theta = Math.acos(Math.max(-1, Math.min(1, z)));
    if (theta > this.halfApertureRad) return false;
    const s = Math.hypot(x, y);
    const rho = theta / this.radPerPx;
    out[0] = this.size / 2 + (s > 0 ? (rho * x) / s : 0);
    out[1] = this.size / 2 - (s > 0 ? (rho * y) / s : 0);
    return true;
  }
}

/** Equirectangular 360 x 180: longitude across (0 at the centre, positive to the right), latitude up. */
class EquirectProjector implements Projector {
  constructor(
    private readonly width: number,
    private readonly height: number,
  ) {}
  pixelToView(out: Float64Array, px: number, py: number): number {
    return pixelToViewVia(this, out, px, py);
  }
  project(io: Float64Array): void {
    const lon = (io[0] / this.width - 0.5) * 2 * Math.PI;
    const lat = (0.5 - io[1] / this.height) * Math.PI;
    const c = Math.cos(lat);
    io[2] = c * Math.sin(lon);
    io[3] = Math.sin(lat);
    io[4] = c * Math.cos(lon);
    io[5] = Math.max((2 * Math.PI * c) / this.width, Math.PI / this.height);
  }
  viewToPixel(out: Float64Array, x: number, y: number, z: number): boolean {
    const lon = Math.atan2(x, z);
    const lat = Math.asin(Math.max(-1, Math.min(1, y)));
    out[0] = (lon / (2 * Math.PI) + 0.5) * this.width;
    out[1] = (0.5 - lat / Math.PI) * this.height;
    return true;
  }
}

/** The six cube faces as (centre, top) pairs in view space of the 'front' face. */
export const CUBE_FACES: Record<string, readonly [readonly number[], readonly number[]]> = {
  front: [[0, 0, 1], [0, 1, 0]],
  back: [[0, 0, -1], [0, 1, 0]],
  right: [[1, 0, 0], [0, 1, 0]],
  left: [[-1, 0, 0], [0, 1, 0]],
  up: [[0, 1, 0], [0, 0, -1]],
  down: [[0, -1, 0], [0, 0, 1]],
};

/** One 90-degree cube face; directions are returned in the view space of the 'front' face. */
class CubeFaceProjector implements Projector {
  private readonly flat: FlatProjector;
  private readonly centre: readonly number[];
  private readonly top: readonly number[];
  private readonly right: number[];
  constructor(size: number, face: string) {
    this.flat = new FlatProjector(size, size, 90);
    [this.centre, this.top] = CUBE_FACES[face];
    const c = this.centre;
    const t = this.top;
    // right = top x centre in the drawn (left-handed) view convention: front face gives (1, 0, 0)
    this.right = [t[1] * c[2] - t[2] * c[1], t[2] * c[0] - t[0] * c[2], t[0] * c[1] - t[1] * c[0]];
  }
  pixelToView(out: Float64Array, px: number, py: number): number {
    return pixelToViewVia(this, out, px, py);
  }
  project(io: Float64Array): void {
    this.flat.project(io);
    const x = io[2];
    const y = io[3];
    const z = io[4];
    const r = this.right;
    const t = this.top;
    const c = this.centre;
    io[2] = x * r[0] + y * t[0] + z * c[0];
    io[3] = x * r[1] + y * t[1] + z * c[1];
    io[4] = x * r[2] + y * t[2] + z * c[2];
  }
  viewToPixel(out: Float64Array, x: number, y: number, z: number): boolean {
    const r = this.right;
    const t = this.top;
    const c = this.centre;
    return this.flat.viewToPixel(
      out,
      x * r[0] + y * r[1] + z * r[2],
      x * t[0] + y * t[1] + z * t[2],
      x * c[0] + y * c[1] + z * c[2],
    );
  }
}

/**
 * Build the projector for a frame.
 * @param projection validated projection settings (degrees)
 * @param width frame width, px (1..8192)
 * @param height frame height, px (1..8192)
 * @returns a projector; dome and cube-face frames must be square
 * @throws RangeError for bad sizes or non-square dome/cube frames
 */
export function createProjector(projection: Projection, width: number, height: number): Projector {
  if (!Number.isInteger(width) || width < 1 || width > 8192) throw new RangeError('width: integer 1..8192 px');
  if (!Number.isInteger(height) || height < 1 || height > 8192) throw new RangeError('height: integer 1..8192 px');
  switch (projection.kind) {
    case 'flat':
      return new FlatProjector(width, height, projection.fovDeg);
    case 'dome':
      if (width !== height) throw new RangeError('height: must equal width for a dome master');
      return new DomeProjector(width, projection.apertureDeg);
    case 'equirect':
      return new EquirectProjector(width, height);
    case 'cubeFace':
      if (width !== height) throw new RangeError('height: must equal width for a cube face');
      return new CubeFaceProjector(width, projection.face);
  }
}

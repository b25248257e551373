/**
 * The working resolution of the photosensitivity check: the frame cut into
 * square blocks of k x k pixels ("cells"), k the largest whole number for which
 * a cell spans at most maxCellDeg at the frame's coarsest pixel. Each cell
 * knows its exact solid angle (the sum of its pixels' solid angles from the
 * renderer's projector) and its mean view direction.
 */
import type { Projector } from '../render/projections';
import { createSolidAngleScratch, pixelSolidAngleSr } from './solidAngle';

const RAD_TO_DEG = 180 / Math.PI;
/** Lattice used to find the coarsest pixel: the projections' pixel size varies smoothly, so 65 x 65 samples plus the centre suffice. */
const PIXEL_SIZE_SAMPLES = 65;

/** Cells of one frame geometry. */
export interface WorkingGrid {
  /** Frame size, px. */
  width: number;
  height: number;
  /** Cell side, px (k). */
  blockPx: number;
  /** Angular size of the frame's coarsest pixel, degrees. */
  pixelDeg: number;
  /** Angular size of the coarsest cell, degrees (k x pixelDeg). */
  cellDeg: number;
  /** Cells across and down. */
  columns: number;
  rows: number;
  /** columns x rows. */
  cellCount: number;
  /** Solid angle of each cell, sr (0 for a block with no pixel in the image). */
  cellSolidAngleSr: Float64Array;
  /** Pixels of each cell inside the image. */
  cellPixelCount: Uint32Array;
  /** Unit mean view direction of each cell (x right, y up, z frame centre), 3 per cell. */
  cellDirection: Float64Array;
  /** First and one-past-last pixel inside the image in each frame row (the image's rows are single runs in every projection). */
  rowStart: Int32Array;
  rowEnd: Int32Array;
  /** Cell column of each frame column. */
  columnOfPixel: Int32Array;
}

/**
 * Largest angular size of a pixel over the frame.
 * @param projector the renderer's projector
 * @param width frame width, px
 * @param height frame height, px
 * @returns radians
 */
export function coarsestPixelRad(projector: Projector, width: number, height: number): number {
  const v = new Float64Array(3);
  let worst = projector.pixelToView(v, Math.floor(width / 2) + 0.5, Math.floor(height / 2) + 0.5);
  for (let j = 0; j < PIXEL_SIZE_SAMPLES; j++) {
    const py = Math.min(height - 1, Math.floor(((j + 0.5) * height) / PIXEL_SIZE_SAMPLES)) + 0.5;
    for (let i = 0; i < PIXEL_SIZE_SAMPLES; i++) {
      const px = Math.min(width - 1, Math.floor(((i + 0.5) * width) / PIXEL_SIZE_SAMPLES)) + 0.5;
      worst = Math.max(worst, projector.pixelToView(v, px, py));
    }
  }
  return worst;
}

/**
 * Build the working grid of a frame geometry (done once per sequence).
 * @param projector the renderer's projector for this frame (createProjector)
 * @param width frame width, px (1..8192)
 * @param height frame height, px (1..8192)
 * @param maxCellDeg largest angular size of a cell, degrees (0.01..2)
 * @returns the grid
 * @throws RangeError for bad sizes or cell size
 */
export function buildWorkingGrid(projector: Projector, width: number, height: number, maxCellDeg: number): WorkingGrid {
  if (!Number.isInteger(width) || width < 1 || width > 8192) throw new RangeError('width: integer 1..8192 px');
  if (!Number.isInteger(height) || height < 1 || height > 8192) throw new RangeError('height: integer 1..8192 px');
  if (!Number.isFinite(maxCellDeg) || maxCellDeg < 0.01 || maxCellDeg > 2) throw new RangeError('maxCellDeg: 0.01..2 degrees');
  const pixelRad = coarsestPixelRad(projector, width, height);
  if (!(pixelRad > 0)) throw new RangeError('projection: the frame shows no image');
  const pixelDeg = pixelRad * RAD_TO_DEG;
  const blockPx = Math.max(1, Math.min(Math.floor(maxCellDeg / pixelDeg), width, height));
  const columns = Math.ceil(width / blockPx);
  const rows = Math.ceil(height / blockPx);
  const cellCount = columns * rows;
  const cellSolidAngleSr = new Float64Array(cellCount);
  const cellPixelCount = new Uint32Array(cellCount);
  const cellDirection = new Float64Array(3 * cellCount);
  const rowStart = new Int32Array(height);
  const rowEnd = new Int32Array(height);
  const columnOfPixel = new Int32Array(width);
  for (let x = 0; x < width; x++) columnOfPixel[x] = Math.floor(x / blockPx);
  // Three rows of pixel-centre directions (above, this, below): each pixel's Jacobian comes from
  // central differences of its neighbours' directions (error ~ (pixel angle)^2 / 6, under 1e-4 for
  // pixels under 1.4 degrees), so setup costs one projector call per pixel; where a neighbour lies
  // outside the image the difference is one-sided, and an isolated pixel falls back to pixelSolidAngleSr.
  let above = new Float64Array(3 * width);
  let here = new Float64Array(3 * width);
  let below = new Float64Array(3 * width);
  let aboveOk = new Uint8Array(width);
  let hereOk = new Uint8Array(width);
  let belowOk = new Uint8Array(width);
  const v = new Float64Array(3);
  const loadRow = (dirs: Float64Array, ok: Uint8Array, y: number) => {
    if (y < 0 || y >= height) {
      ok.fill(0);
      return;
    }
    for (let x = 0; x < width; x++) {
      ok[x] = projector.pixelToView(v, x + 0.5, y + 0.5) >= 0 ? 1 : 0;
      dirs[3 * x] = v[0];
      dirs[3 * x + 1] = v[1];
      dirs[3 * x + 2] = v[2];
    }
  };
  loadRow(here, hereOk, 0);
  loadRow(below, belowOk, 1);
  const scratch = createSolidAngleScratch();
  for (let y = 0; y < height; y++) {
    const rowBase = Math.floor(y / blockPx) * columns;
    let first = -1;
    let last = -1;
    for (let x = 0; x < width; x++) {
      if (hereOk[x] === 0) continue;
      const o = 3 * x;
      const left = x > 0 && hereOk[x - 1] === 1 ? o - 3 : o;
      const right = x + 1 < width && hereOk[x + 1] === 1 ? o + 3 : o;
      const up = aboveOk[x] === 1;
      const down = belowOk[x] === 1;
      let omega: number;
      if (left === right || (!up && !down)) {
        omega = pixelSolidAngleSr(projector, x + 0.5, y + 0.5, scratch);
      } else {
        const sx = (right - left) / 3;
        const ax = (here[right] - here[left]) / sx, ay = (here[right + 1] - here[left + 1]) / sx, az = (here[right + 2] - here[left + 2]) / sx;
        const top = up ? above : here;
        const bottom = down ? below : here;
        const sy = (up ? 1 : 0) + (down ? 1 : 0);
        const bx = (bottom[o] - top[o]) / sy, by = (bottom[o + 1] - top[o + 1]) / sy, bz = (bottom[o + 2] - top[o + 2]) / sy;
        const cx = ay * bz - az * by, cy = az * bx - ax * bz, cz = ax * by - ay * bx;
        omega = Math.sqrt(cx * cx + cy * cy + cz * cz);
      }
      if (!(omega > 0)) continue;
      if (first < 0) first = x;
      last = x;
      const cell = rowBase + columnOfPixel[x];
      cellSolidAngleSr[cell] += omega;
      cellPixelCount[cell]++;
      cellDirection[3 * cell] += omega * here[o];
      cellDirection[3 * cell + 1] += omega * here[o + 1];
      cellDirection[3 * cell + 2] += omega * here[o + 2];
    }
    rowStart[y] = first < 0 ? 0 : first;
    rowEnd[y] = first < 0 ? 0 : last + 1;
    [above, here, below] = [here, below, above];
    [aboveOk, hereOk, belowOk] = [hereOk, belowOk, aboveOk];
    loadRow(below, belowOk, y + 2);
  }
  for (let cell = 0; cell < cellCount; cell++) {
    const o = 3 * cell;
    const n = Math.hypot(cellDirection[o], cellDirection[o + 1], cellDirection[o + 2]);
    if (n > 0) {
      cellDirection[o] /= n;
      cellDirection[o + 1] /= n;
      cellDirection[o + 2] /= n;
    }
  }
  return {
    width, height, blockPx, pixelDeg, cellDeg: blockPx * pixelDeg, columns, rows, cellCount,
    cellSolidAngleSr, cellPixelCount, cellDirection, rowStart, rowEnd, columnOfPixel,
  };
}

/**
 * Screen tiles sorted by where their rays can end, so the WebGL view shades
 * each pixel with only the code it can need. Software WebGL (SwiftShader)
 * runs every instruction of a program for every pixel it rasterizes, taken
 * or not, and it does not skip the shader for pixels a depth or stencil test
 * rejects; only the drawn geometry limits its work. So the frame is cut into
 * FATE_TILE_PX squares and each square is drawn with one of three programs:
 * the sky program (stars, Milky Way; no horizon grids) where every ray
 * reaches the sky, the surface program (horizon and far-side grids only)
 * where every ray ends on r = 2M, and the full program where both can occur
 * (or, in a dome master, where the tile crosses the image circle). Tiles wholly
 * outside a dome master's circle are not drawn.
 *
 * A ray's fate depends only on its look angle psi from the outward radial
 * direction (after the camera's aberration), through the ray table's
 * segments (lib/relativity RayTable). A tile's rays all lie within an angle
 * of its centre's ray (triangle inequality on the sphere), so the tile's psi
 * lies in [psi_c - r, psi_c + r], and its class follows from the fates of the
 * segments that interval meets. Every pixel's program therefore computes the
 * same value the full program would (tests/unit/webgl/fateTiles.test.ts checks
 * this against lib/webgl/sourceDirections.ts, pixel by pixel).
 */
import type { Projector } from '../render/projections';
import { boostLookDirection } from '../relativity/boost';
import { FATE_SKY } from '../relativity/rayTable';
import { PROJECTION_CODES, type ProjectionConstants } from './projectionConstants';
import { packedSegmentOf, type PackedRayTable } from './rayTableTexture';

/** Tile edge, pixels: small enough to hug the shadow's edge, large enough to keep the vertex count low. */
export const FATE_TILE_PX = 16;

/** Tile classes: not drawn (outside a dome master's circle), sky only, surface (r = 2M) only, either. */
export const TILE_NONE = 0;
export const TILE_SKY = 1;
export const TILE_SURFACE = 2;
export const TILE_MIXED = 3;
/** A sky tile whose eight neighbours are sky tiles too (interpolated geometry is safe there, see interiorSkyTiles). */
export const TILE_SKY_INTERIOR = 4;

/** Pixels between the traced grid points whose geometry interior sky tiles interpolate (shaders/sky.geometry.frag). */
export const GEOMETRY_STEP_PX = 4;

/**
 * Size of that grid for a frame: grid point (i, j) is the centre of pixel (i, j) x GEOMETRY_STEP_PX, and the grid
 * reaches one point past the last pixel, so every pixel lies between four points.
 * @param width frame width, px
 * @param height frame height, px
 * @returns grid points across and down
 */
export function geometryGridSize(width: number, height: number): { across: number; down: number } {
  return { across: Math.floor((width - 1) / GEOMETRY_STEP_PX) + 2, down: Math.floor((height - 1) / GEOMETRY_STEP_PX) + 2 };
}

/**
 * Safety factor on a tile's angular radius: covers the curvature of its sampled edges between the sample
 * points (a few percent for 16 px tiles even under strong aberration), and float32 rounding on the GPU.
 */
const RADIUS_SAFETY = 1.25;

/** The tiles of one frame. */
export interface FateTiles {
  tilesX: number;
  tilesY: number;
  /** class of tile (column tx, row ty from the top) at ty * tilesX + tx */
  classes: Uint8Array;
}

/** What the classifier needs of a GPU frame (lib/webgl prepareGpuFrame). */
export interface FateTileFrame {
  width: number;
  height: number;
  projection: ProjectionConstants;
  /** view space -> camera frame, row-major 3x3 */
  viewToCamera: Float64Array;
  /** camera velocity relative to the reference observer, camera frame, units of c */
  boostVelocity: Float64Array;
  /** packed ray table (fates per psi segment) */
  table: PackedRayTable;
}

/**
 * Class of the look-angle interval [lo, hi]: sky if every segment it meets ends on the sky (fate 0), surface
 * if none does, mixed otherwise.
 */
function intervalClass(table: PackedRayTable, lo: number, hi: number): number {
  const first = packedSegmentOf(table, lo);
  const last = packedSegmentOf(table, hi);
  let sky = false;
  let surface = false;
  for (let k = first; k <= last; k++) {
    if (table.segmentA[4 * k + 3] === FATE_SKY) sky = true;
    else surface = true;
  }
  return sky && surface ? TILE_MIXED : sky ? TILE_SKY : TILE_SURFACE;
}

/**
 * Sort a frame's tiles by where their rays can end.
 * @param frame the GPU frame (its ray table must be present: lensing on)
 * @param projector lib/render projector of the same projection and size
 * @param tilePx tile edge in pixels (default FATE_TILE_PX)
 * @returns the tile classes
 * @throws RangeError for a tile size below 1 px
 */
export function classifyFateTiles(frame: FateTileFrame, projector: Projector, tilePx = FATE_TILE_PX): FateTiles {
  if (!(Number.isInteger(tilePx) && tilePx >= 1)) throw new RangeError(`tilePx must be an integer >= 1; got ${tilePx}`);
  const { width, height, table } = frame;
  const tilesX = Math.ceil(width / tilePx);
  const tilesY = Math.ceil(height / tilePx);
  const classes = new Uint8Array(tilesX * tilesY);
  const dome = frame.projection.kind === PROJECTION_CODES.dome;
  const circlePx = dome ? frame.projection.halfApertureRad / frame.projection.radPerPx : Infinity;
  const m = frame.viewToCamera;
  const v = frame.boostVelocity;
  const speed = Math.hypot(v[0], v[1], v[2]);
  // largest local angular scale of aberration (Einstein 1905): sqrt((1 + v) / (1 - v))
  const maxDoppler = Math.sqrt((1 + speed) / (1 - speed));
  const view = new Float64Array(3);
  const camera = new Float64Array(3);
  const reference = new Float64Array(3);
  // reference-frame directions on a half-tile grid (tile corners, edge midpoints and centres, each computed
  // once and shared by neighbouring tiles), with the pixel's angular size there, or -1 outside the image
  const gridX = 2 * tilesX + 1;
  const gridY = 2 * tilesY + 1;
  // even entries: tile edges (the last one clipped to the frame); odd entries: the midpoints between them
  const halfGrid = (count: number, size: number) => {
    const edge = (k: number) => Math.min(size, k * tilePx);
    return Float64Array.from({ length: count }, (_, i) => (i % 2 === 0 ? edge(i / 2) : (edge((i - 1) / 2) + edge((i + 1) / 2)) / 2));
  };
  const xs = halfGrid(gridX, width);
  const ys = halfGrid(gridY, height);
  const dirs = new Float64Array(3 * gridX * gridY);
  const pixelRads = new Float64Array(gridX * gridY);
  for (let j = 0; j < gridY; j++) {
    for (let i = 0; i < gridX; i++) {
      const g = j * gridX + i;
      const pixelRad = projector.pixelToView(view, xs[i], ys[j]);
      pixelRads[g] = pixelRad;
      if (pixelRad < 0) continue;
      camera[0] = m[0] * view[0] + m[1] * view[1] + m[2] * view[2];
      camera[1] = m[3] * view[0] + m[4] * view[1] + m[5] * view[2];
      camera[2] = m[6] * view[0] + m[7] * view[1] + m[8] * view[2];
      boostLookDirection(reference, camera, v);
      dirs[3 * g] = reference[0];
      dirs[3 * g + 1] = reference[1];
      dirs[3 * g + 2] = reference[2];
    }
  }
  const cx = width / 2;
  const cy = height / 2;
  for (let ty = 0; ty < tilesY; ty++) {
    for (let tx = 0; tx < tilesX; tx++) {
      const x0 = xs[2 * tx];
      const x1 = xs[2 * tx + 2];
      const y0 = ys[2 * ty];
      const y1 = ys[2 * ty + 2];
      const index = ty * tilesX + tx;
      if (dome) {
        // distance from the frame centre (cx, cy) to the tile's nearest and farthest points
        const nearX = Math.max(x0 - cx, 0, cx - x1);
        const nearY = Math.max(y0 - cy, 0, cy - y1);
        const farX = Math.max(Math.abs(x0 - cx), Math.abs(x1 - cx));
        const farY = Math.max(Math.abs(y0 - cy), Math.abs(y1 - cy));
        if (Math.hypot(nearX, nearY) > circlePx + 1) {
          classes[index] = TILE_NONE;
          continue;
        }
        if (Math.hypot(farX, farY) > circlePx - 1) {
          classes[index] = TILE_MIXED;
          continue;
        }
      }
      const c = (2 * ty + 1) * gridX + 2 * tx + 1;
      const pixelRad = pixelRads[c];
      if (pixelRad < 0) {
        classes[index] = TILE_MIXED;
        continue;
      }
      // angular radius: the farthest of the tile's corners and edge midpoints from its centre (largest chord,
      // then its angle), with margins
      let chord2 = 0;
      for (let j = 0; j <= 2; j++) {
        for (let i = 0; i <= 2; i++) {
          const g = (2 * ty + j) * gridX + 2 * tx + i;
          if (g === c || pixelRads[g] < 0) continue;
          const ex = dirs[3 * g] - dirs[3 * c];
          const ey = dirs[3 * g + 1] - dirs[3 * c + 1];
          const ez = dirs[3 * g + 2] - dirs[3 * c + 2];
          chord2 = Math.max(chord2, ex * ex + ey * ey + ez * ez);
        }
      }
      const radius = 2 * Math.asin(Math.min(1, Math.sqrt(chord2) / 2)) * RADIUS_SAFETY + 2 * pixelRad * maxDoppler;
      const psi = Math.atan2(Math.hypot(dirs[3 * c + 1], dirs[3 * c + 2]), dirs[3 * c]);
      classes[index] = intervalClass(table, Math.max(0, psi - radius), Math.min(Math.PI, psi + radius));
    }
  }
  return { tilesX, tilesY, classes };
}

/**
 * The tiles with the sky tiles split: TILE_SKY_INTERIOR where all eight neighbours are sky tiles, TILE_SKY where
 * one is not or the tile lies on the frame's border. A pixel of an interior tile can take its geometry from a
 * grid of traced points a few pixels apart (sky.geometry.frag): every grid point it interpolates between lies
 * in its tile or a neighbour, so on the sky, and the lens map is smooth there (the shadow's edge, where phi
 * diverges, is at least a tile away).
 * @param tiles classified tiles
 * @returns a copy with the interior sky tiles marked
 */
export function interiorSkyTiles(tiles: FateTiles): FateTiles {
  const { tilesX, tilesY, classes } = tiles;
  const out = new Uint8Array(classes);
  for (let ty = 1; ty < tilesY - 1; ty++) {
    for (let tx = 1; tx < tilesX - 1; tx++) {
      let interior = true;
      for (let dy = -1; dy <= 1 && interior; dy++) for (let dx = -1; dx <= 1; dx++) if (classes[(ty + dy) * tilesX + tx + dx] !== TILE_SKY) interior = false;
      if (interior) out[ty * tilesX + tx] = TILE_SKY_INTERIOR;
    }
  }
  return { tilesX, tilesY, classes: out };
}

/** Write clip-space vertex n (z = 0); returns n + 1. */
function vertex(out: Float32Array, n: number, x: number, y: number): number {
  out[3 * n] = x;
  out[3 * n + 1] = y;
  out[3 * n + 2] = 0;
  return n + 1;
}

/**
 * Clip-space triangles (x, y, z per vertex) covering the tiles of one class, as few rectangles as a greedy
 * merge finds (each run of same-class tiles along a row, grown downwards while the rows below match), two
 * triangles per rectangle. Why merge: software WebGL shades 2 x 2 pixel quads, and a quad that a triangle
 * edge cuts is shaded by both triangles; the diagonal of a 16 px tile cuts 8 of its 64 quads (12.5% of the
 * work twice), that of a w x h quad rectangle about w + h of w h.
 * @param tiles classified tiles
 * @param tileClass TILE_SKY, TILE_SKY_INTERIOR, TILE_SURFACE or TILE_MIXED
 * @param width frame width, px
 * @param height frame height, px
 * @param out receives the vertices; needs 18 floats per tile of the frame
 * @param tilePx tile edge in pixels, as classified
 * @returns the number of vertices written
 */
export function tileTriangles(tiles: FateTiles, tileClass: number, width: number, height: number, out: Float32Array, tilePx = FATE_TILE_PX): number {
  const { tilesX, tilesY, classes } = tiles;
  const taken = new Uint8Array(classes.length);
  const free = (tx: number, ty: number) => classes[ty * tilesX + tx] === tileClass && taken[ty * tilesX + tx] === 0;
  // columns tx .. tx + runX - 1 of row ty all free
  const runFree = (tx: number, runX: number, ty: number) => {
    for (let k = 0; k < runX; k++) if (!free(tx + k, ty)) return false;
    return true;
  };
  let n = 0;
  for (let ty = 0; ty < tilesY; ty++) {
    for (let tx = 0; tx < tilesX; tx++) {
      if (!free(tx, ty)) continue;
      let runX = 1;
      while (tx + runX < tilesX && free(tx + runX, ty)) runX++;
      let runY = 1;
      while (ty + runY < tilesY && runFree(tx, runX, ty + runY)) runY++;
      for (let j = 0; j < runY; j++) taken.fill(1, (ty + j) * tilesX + tx, (ty + j) * tilesX + tx + runX);
      const left = (2 * tx * tilePx) / width - 1;
      const right = (2 * Math.min(width, (tx + runX) * tilePx)) / width - 1;
      const top = 1 - (2 * ty * tilePx) / height;
      const bottom = 1 - (2 * Math.min(height, (ty + runY) * tilePx)) / height;
      // (left, top), (left, bottom), (right, top); (right, top), (left, bottom), (right, bottom)
      n = vertex(out, n, left, top);
      n = vertex(out, n, left, bottom);
      n = vertex(out, n, right, top);
      n = vertex(out, n, right, top);
      n = vertex(out, n, left, bottom);
      n = vertex(out, n, right, bottom);
    }
  }
  return n;
}

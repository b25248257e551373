/**
 * A 2-D star index for the GPU star loop: the sphere cut into cube-map tiles
 * (the face of the largest component of a unit vector, then a uniform grid in
 * the other two components divided by it), each tile listing every star within
 * a margin (chord distance) of any point of the tile. Several levels
 * (STAR_TILE_LEVELS): fine tiles with small margins for the usual narrow
 * kernels, coarse tiles whose margin is the widest kernel reach the star loop
 * ever sums (3 sigma below STAR_CELL_SIZE, lib/render/shade.ts); a pixel reads
 * the first level whose margin covers its reach. So every pixel finds all the stars
 * lib/render's star loop would sum (every star with |star - d| below 3 sigma)
 * in one list, with one loop, instead of walking up to eight cells of
 * lib/render's 3-D grid (lib/render/starField.ts), three nested loops that
 * software WebGL runs slowly. Built once per catalogue and magnitude limit.
 * The GPU twin of starTileOf is starTileIndex in shaders/sky.lensed.frag.
 *
 * Software WebGL runs a loop for the longest list among neighbouring pixels,
 * and one texture fetch per star costs about as much as the rest of the
 * iteration, so the lists are short (fine tiles where kernels are narrow)
 * and each star is one RGBA texel.
 */
import type { StarField } from '../render/starField';
import { forEachStarNear, STAR_CELL_SIZE } from '../render/starField';
import type { FloatImage } from './skyTextures';
import { ARRAY_TEXTURE_WIDTH, arrayTextureRows } from './arrayTexture';

/** One level of tiles. */
export interface StarTileLevel {
  /** tiles per cube-face edge */
  tilesPerEdge: number;
  /** largest star-kernel reach (3 sigma, chord of unit vectors) the level's lists serve */
  marginChord: number;
}

/**
 * The levels, narrowest margin first. Reaches are about 2.4 pixel footprints (sigma 0.8 px): 0.0026 at
 * 1280 x 720 and 0.0053 at 640 x 360 for a 70-degree flat frame, more where lensing magnifies (up to
 * STAR_CELL_SIZE, the widest reach summed star by star, in the squeezed ring around the shadow). With the
 * 8.5 mag catalogue (41,411 stars) the lists hold on average 0.28, 1.58, 3.1 and 8.5 stars (longest 8, 19, 23
 * and 38). Against 256 per edge (0.72 stars) the first level's finer tiles cut the HD frame's star loop by more
 * than half, and the 0.013 level saves about 9% of a frame with a wide squeezed ring; all four take about
 * 60 MB of textures (3.1 million entries).
 */
export const STAR_TILE_LEVELS: readonly StarTileLevel[] = [
  { tilesPerEdge: 512, marginChord: 0.003 },
  { tilesPerEdge: 256, marginChord: 0.008 },
  { tilesPerEdge: 256, marginChord: 0.013 },
  { tilesPerEdge: 128, marginChord: STAR_CELL_SIZE },
];

/**
 * Extra margin added when the lists are built, chord: covers float32 rounding of the GPU's tile choice
 * (~1e-7) many times over.
 */
const SAFETY_CHORD = 1e-5;

/** A 1-D array of unsigned integers laid out in rows of a texture (one channel). */
export interface UintImage {
  width: number;
  height: number;
  data: Uint32Array;
}

/** The tile index in GPU form. */
export interface StarTileIndex {
  /**
   * One unsigned integer per tile: first entry << countBits | entry count. Tile t of a level is element
   * levelOffset[level] + (face * tilesPerEdge + row) * tilesPerEdge + column, ARRAY_TEXTURE_WIDTH per row.
   */
  tiles: UintImage;
  /** low bits of a packed tile holding its list length: the fewest that hold the longest list */
  countBits: number;
  /** first element of each level in `tiles` */
  levelOffset: number[];
  /**
   * RGBA per entry: the star's hole-frame unit vector times its flux (mag-0 units; its length is the flux),
   * and ln(T / 1 K); ARRAY_TEXTURE_WIDTH wide. decodeStarEntry reads one back.
   */
  entries: FloatImage;
  /** number of entries (a star appears in every tile it is near) */
  entryCount: number;
  /** longest list (sets countBits) */
  maxListLength: number;
}

/** Smallest flux stored, so a zero-flux star keeps a direction (its light stays negligible). */
const MIN_ENTRY_FLUX = 1e-12;

/** One decoded entry. */
export interface StarEntry {
  x: number;
  y: number;
  z: number;
  flux: number;
  logTemperature: number;
}

/**
 * Read entry e back as the shader does (direction = vector / length, flux = length).
 * @param index the tile index
 * @param e entry number, 0..entryCount-1
 * @param out record written
 * @returns out
 */
export function decodeStarEntry(index: StarTileIndex, e: number, out: StarEntry): StarEntry {
  const d = index.entries.data;
  const flux = Math.hypot(d[4 * e], d[4 * e + 1], d[4 * e + 2]);
  out.x = d[4 * e] / flux;
  out.y = d[4 * e + 1] / flux;
  out.z = d[4 * e + 2] / flux;
  out.flux = flux;
  out.logTemperature = d[4 * e + 3];
  return out;
}

/** (first entry, count) of a packed tile whose count takes the low countBits bits. */
export function unpackTile(packed: number, countBits: number): { first: number; count: number } {
  return { first: Math.floor(packed / 2 ** countBits), count: packed % 2 ** countBits };
}

/** Tile of a unit vector: face 0..5 (+x, -x, +y, -y, +z, -z) and column/row on that face. */
export interface StarTile {
  face: number;
  column: number;
  row: number;
}

/**
 * The tile holding a direction (the shader's starTile).
 * @param x hole-frame unit vector x (any non-zero vector; only its direction matters)
 * @param y unit vector y
 * @param z unit vector z
 * @param tilesPerEdge tiles per face edge (a STAR_TILE_LEVELS entry), integer >= 1
 * @param out record written
 * @returns out
 * @throws RangeError for a zero or non-finite vector or a bad tile count
 */
export function starTileOf(x: number, y: number, z: number, tilesPerEdge: number, out: StarTile): StarTile {
  if (!Number.isInteger(tilesPerEdge) || tilesPerEdge < 1) throw new RangeError(`tilesPerEdge must be an integer >= 1; got ${tilesPerEdge}`);
  const ax = Math.abs(x);
  const ay = Math.abs(y);
  const az = Math.abs(z);
  if (!(Number.isFinite(ax + ay + az) && ax + ay + az > 0)) throw new RangeError('x, y, z: a finite non-zero vector');
  let u: number;
  let v: number;
  if (ax >= ay && ax >= az) {
    out.face = x >= 0 ? 0 : 1;
    u = y / ax;
    v = z / ax;
  } else if (ay >= az) {
    out.face = y >= 0 ? 2 : 3;
    u = x / ay;
    v = z / ay;
  } else {
    out.face = z >= 0 ? 4 : 5;
    u = x / az;
    v = y / az;
  }
  const n = tilesPerEdge;
  out.column = Math.min(n - 1, Math.max(0, Math.floor((u + 1) * 0.5 * n)));
  out.row = Math.min(n - 1, Math.max(0, Math.floor((v + 1) * 0.5 * n)));
  return out;
}

/** Unit vector of face coordinates (u, v) in -1..1 on a face, into out. */
function faceDirection(face: number, u: number, v: number, out: Float64Array): void {
  const s = face % 2 === 0 ? 1 : -1;
  const inv = 1 / Math.sqrt(1 + u * u + v * v);
  const a = face < 2 ? s : u;
  const b = face < 2 ? u : face < 4 ? s : v;
  const c = face < 4 ? v : s;
  out[0] = a * inv;
  out[1] = b * inv;
  out[2] = c * inv;
}

/** Growable list of star indices. */
interface StarList {
  items: Int32Array;
  used: number;
}

/** Append the lists of one level's tiles to `list`; tile t's (first, count) go to first[t], count[t]. */
function addLevel(field: StarField, n: number, margin: number, list: StarList, first: Uint32Array, count: Uint32Array): void {
  const centre = new Float64Array(3);
  const corner = new Float64Array(3);
  const step = 2 / n;
  const add = (s: number): void => {
    if (list.used === list.items.length) {
      const grown = new Int32Array(2 * list.items.length);
      grown.set(list.items);
      list.items = grown;
    }
    list.items[list.used++] = s;
  };
  for (let face = 0; face < 6; face++) {
    for (let row = 0; row < n; row++) {
      for (let column = 0; column < n; column++) {
        const u0 = -1 + column * step;
        const v0 = -1 + row * step;
        faceDirection(face, u0 + 0.5 * step, v0 + 0.5 * step, centre);
        // the tile's edges are great-circle arcs, so its farthest point from the centre is a corner
        let radius = 0;
        for (let k = 0; k < 4; k++) {
          faceDirection(face, u0 + (k & 1) * step, v0 + (k >> 1) * step, corner);
          const ex = corner[0] - centre[0];
          const ey = corner[1] - centre[1];
          const ez = corner[2] - centre[2];
          radius = Math.max(radius, Math.sqrt(ex * ex + ey * ey + ez * ez));
        }
        // triangle inequality on chords: a star within the margin of a tile point is within this of the centre
        const reach = radius + margin + SAFETY_CHORD;
        const reach2 = reach * reach;
        const cx = centre[0];
        const cy = centre[1];
        const cz = centre[2];
        const tile = face * n * n + row * n + column;
        first[tile] = list.used;
        forEachStarNear(field, cx, cy, cz, reach, (s) => {
          const ex = field.x[s] - cx;
          const ey = field.y[s] - cy;
          const ez = field.z[s] - cz;
          if (ex * ex + ey * ey + ez * ez <= reach2) add(s);
        });
        count[tile] = list.used - first[tile];
      }
    }
  }
}

/**
 * Build the tile lists of a star field.
 * @param field lib/render star field (buildStarField)
 * @returns the index
 */
export function buildStarTileIndex(field: StarField): StarTileIndex {
  const list: StarList = { items: new Int32Array(1 << 16), used: 0 };
  const levelOffset: number[] = [];
  let tileCount = 0;
  for (const level of STAR_TILE_LEVELS) {
    levelOffset.push(tileCount);
    tileCount += 6 * level.tilesPerEdge * level.tilesPerEdge;
  }
  const first = new Uint32Array(tileCount);
  const count = new Uint32Array(tileCount);
  STAR_TILE_LEVELS.forEach((level, k) => {
    const end = levelOffset[k] + 6 * level.tilesPerEdge * level.tilesPerEdge;
    addLevel(field, level.tilesPerEdge, level.marginChord, list, first.subarray(levelOffset[k], end), count.subarray(levelOffset[k], end));
  });
  const used = list.used;
  let maxListLength = 0;
  for (let t = 0; t < tileCount; t++) maxListLength = Math.max(maxListLength, count[t]);
  const countBits = Math.max(1, Math.ceil(Math.log2(maxListLength + 1)));
  if (used * 2 ** countBits > 2 ** 32) throw new RangeError(`${used} star tile entries with lists of up to ${maxListLength} do not fit 32-bit packed tiles`);
  const tileRows = arrayTextureRows(tileCount);
  const tiles: UintImage = { width: ARRAY_TEXTURE_WIDTH, height: tileRows, data: new Uint32Array(ARRAY_TEXTURE_WIDTH * tileRows) };
  for (let t = 0; t < tileCount; t++) tiles.data[t] = first[t] * 2 ** countBits + count[t];
  const entryRows = arrayTextureRows(used);
  const entries: FloatImage = { width: ARRAY_TEXTURE_WIDTH, height: entryRows, channels: 4, data: new Float32Array(ARRAY_TEXTURE_WIDTH * entryRows * 4) };
  for (let k = 0; k < used; k++) {
    const s = list.items[k];
    const flux = Math.max(field.flux[s], MIN_ENTRY_FLUX);
    entries.data[4 * k] = field.x[s] * flux;
    entries.data[4 * k + 1] = field.y[s] * flux;
    entries.data[4 * k + 2] = field.z[s] * flux;
    entries.data[4 * k + 3] = field.logTemperature[s];
  }
  return { tiles, countBits, levelOffset, entries, entryCount: used, maxListLength };
}

/**
 * A 2-D star index for the GPU star loop: the sphere cut into cube-map tiles
 * (the texels of a cube map, with the faces and texel axes of OpenGL ES 3.0
 * section 3.8.10, so the GPU's own cube-map lookup finds a direction's tile),
 * each tile listing every star within a margin (chord distance) of any point
 * of the tile. Several levels (STAR_TILE_LEVELS, one channel of the cube map
 * each, a coarse tile's word repeated in every texel it covers): fine tiles
 * with small margins for the usual narrow kernels, coarse tiles
 * whose margin is the widest kernel reach the star loop ever sums (3 sigma
 * below STAR_CELL_SIZE, lib/render/shade.ts); a pixel reads the first level
 * whose margin covers its reach. So every pixel finds all the stars
 * lib/render's star loop would sum (every star with |star - d| below 3 sigma)
 * in one list, with one loop, instead of walking up to eight cells of
 * lib/render's 3-D grid (lib/render/starField.ts), three nested loops that
 * software WebGL runs slowly. Built once per catalogue and magnitude limit.
 *
 * Why a cube map, and why the levels as channels: software WebGL
 * (SwiftShader) finds a cube-map texel in its own compiled sampler, where the
 * same face choice and texel arithmetic written in GLSL cost about 13% of a
 * 1280x720 frame; but its sampler for a mip-mapped cube map costs that gain
 * again. One fetch of four channels gives every level's list. The shader's
 * textureLod on the tile cube is the GPU twin of starTileOf.
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
 * The levels, narrowest margin first, one per channel of the tile cube (so four at most); each level's tiles
 * per edge divide STAR_TILE_CUBE_EDGE. Reaches are about 2.4 pixel footprints (sigma 0.8 px): 0.0026 at
 * 1280 x 720 and 0.0053 at 640 x 360 for a 70-degree flat frame, more where lensing or aberration widen the
 * footprints (in the bench's falling camera nearly every sky pixel reaches 0.003-0.01), up to STAR_CELL_SIZE,
 * the widest reach summed star by star, in the squeezed ring around the shadow. With the 8.5 mag catalogue
 * (41,411 stars) the lists hold on average 0.61, 1.70, 3.1 and 8.5 stars (longest 11, 19, 23 and 38); the
 * entries take 59 MB (3.7 million) and the cube 25 MB. The first margin covers a 640 x 360 frame's usual reach,
 * so the editor's preview reads the short lists; against margins 0.003 and 0.008 for the first two levels these
 * shorten the bench frame's star loop by about 12% (modelled) and gave 2-3% of a frame (A/B in one page).
 */
export const STAR_TILE_LEVELS: readonly StarTileLevel[] = [
  { tilesPerEdge: 512, marginChord: 0.0055 },
  { tilesPerEdge: 256, marginChord: 0.0085 },
  { tilesPerEdge: 256, marginChord: 0.013 },
  { tilesPerEdge: 128, marginChord: STAR_CELL_SIZE },
];

/** Texels per edge of each face of the tile cube: the finest level's tiles. */
export const STAR_TILE_CUBE_EDGE = 512;

/**
 * Extra margin added when the lists are built, chord: covers float32 rounding of the GPU's tile choice
 * (~1e-7) many times over.
 */
const SAFETY_CHORD = 1e-5;

/** An image of unsigned integers, `channels` per texel, rows from the first. */
export interface UintImage {
  width: number;
  height: number;
  channels: number;
  data: Uint32Array;
}

/** The tile index in GPU form. */
export interface StarTileIndex {
  /**
   * The tile cube: tiles[face] is that cube-map face (STAR_TILE_CUBE_EDGE texels per edge, column = s texel,
   * row = t texel, as starTileOf), one channel per level (unused channels 0: empty lists), each holding the
   * packed list (first entry << countBits | entry count) of the level's tile that contains the texel.
   */
  tiles: UintImage[];
  /** low bits of a packed tile holding its list length: the fewest that hold the longest list */
  countBits: number;
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

/** Tile of a unit vector: cube-map face 0..5 (+x, -x, +y, -y, +z, -z) and column (s) and row (t) on that face. */
export interface StarTile {
  face: number;
  column: number;
  row: number;
}

/**
 * Per face, the axes of OpenGL ES 3.0.6 section 3.8.10, Table 3.21 (cube map image selection): the major axis
 * (component index and sign), and sc and tc as a sign times a component. A direction d on face f has
 * s = (sc / |ma| + 1) / 2 and t = (tc / |ma| + 1) / 2.
 */
const CUBE_FACES: readonly { major: number; majorSign: number; s: number; sSign: number; t: number; tSign: number }[] = [
  { major: 0, majorSign: 1, s: 2, sSign: -1, t: 1, tSign: -1 },
  { major: 0, majorSign: -1, s: 2, sSign: 1, t: 1, tSign: -1 },
  { major: 1, majorSign: 1, s: 0, sSign: 1, t: 2, tSign: 1 },
  { major: 1, majorSign: -1, s: 0, sSign: 1, t: 2, tSign: -1 },
  { major: 2, majorSign: 1, s: 0, sSign: 1, t: 1, tSign: -1 },
  { major: 2, majorSign: -1, s: 0, sSign: -1, t: 1, tSign: -1 },
];

/**
 * The tile holding a direction, as a cube-map lookup picks its texel (the shader's textureLod on uStarTiles).
 * Where two components are equal in size the GPU may pick either face (the specification leaves it open);
 * either tile holds the direction on its edge, so its list serves it too.
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
  const d = [x, y, z];
  const a = [Math.abs(x), Math.abs(y), Math.abs(z)];
  if (!(Number.isFinite(a[0] + a[1] + a[2]) && a[0] + a[1] + a[2] > 0)) throw new RangeError('x, y, z: a finite non-zero vector');
  const major = a[0] >= a[1] && a[0] >= a[2] ? 0 : a[1] >= a[2] ? 1 : 2;
  out.face = 2 * major + (d[major] >= 0 ? 0 : 1);
  const f = CUBE_FACES[out.face];
  const s = ((f.sSign * d[f.s]) / a[major] + 1) / 2;
  const t = ((f.tSign * d[f.t]) / a[major] + 1) / 2;
  const n = tilesPerEdge;
  out.column = Math.min(n - 1, Math.max(0, Math.floor(s * n)));
  out.row = Math.min(n - 1, Math.max(0, Math.floor(t * n)));
  return out;
}

/** Unit vector of face coordinates sc/|ma| = u and tc/|ma| = v (each -1..1) on a face, into out. */
function faceDirection(face: number, u: number, v: number, out: Float64Array): void {
  const f = CUBE_FACES[face];
  const inv = 1 / Math.sqrt(1 + u * u + v * v);
  out[f.major] = f.majorSign * inv;
  out[f.s] = f.sSign * u * inv;
  out[f.t] = f.tSign * v * inv;
}

/** Growable list of star indices. */
interface StarList {
  items: Int32Array;
  used: number;
}

/** Append the lists of one level's tiles to `list`; tile t = (face * n + row) * n + column's (first, count) go to first[t], count[t]. */
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
  if (STAR_TILE_LEVELS.length > 4 || STAR_TILE_LEVELS.some((level) => STAR_TILE_CUBE_EDGE % level.tilesPerEdge !== 0)) {
    throw new RangeError('STAR_TILE_LEVELS: at most four levels, each with tiles per edge dividing STAR_TILE_CUBE_EDGE');
  }
  const list: StarList = { items: new Int32Array(1 << 16), used: 0 };
  const levels = STAR_TILE_LEVELS.map((level) => {
    const tiles = 6 * level.tilesPerEdge * level.tilesPerEdge;
    const first = new Uint32Array(tiles);
    const count = new Uint32Array(tiles);
    addLevel(field, level.tilesPerEdge, level.marginChord, list, first, count);
    return { n: level.tilesPerEdge, first, count };
  });
  const used = list.used;
  let maxListLength = 0;
  for (const level of levels) for (const c of level.count) maxListLength = Math.max(maxListLength, c);
  const countBits = Math.max(1, Math.ceil(Math.log2(maxListLength + 1)));
  if (used * 2 ** countBits > 2 ** 32) throw new RangeError(`${used} star tile entries with lists of up to ${maxListLength} do not fit 32-bit packed tiles`);
  const edge = STAR_TILE_CUBE_EDGE;
  const tiles = Array.from({ length: 6 }, (_, face): UintImage => {
    const data = new Uint32Array(edge * edge * 4);
    levels.forEach(({ n, first, count }, k) => {
      const texelsPerTile = edge / n;
      for (let row = 0; row < edge; row++) {
        const rowStart = (face * n + Math.floor(row / texelsPerTile)) * n;
        for (let column = 0; column < edge; column++) {
          const t = rowStart + Math.floor(column / texelsPerTile);
          data[4 * (row * edge + column) + k] = first[t] * 2 ** countBits + count[t];
        }
      }
    });
    return { width: edge, height: edge, channels: 4, data };
  });
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
  return { tiles, countBits, entries, entryCount: used, maxListLength };
}

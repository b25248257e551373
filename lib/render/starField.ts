/**
 * Stars ready for per-pixel lookup: unit vectors in the hole frame, flux and
 * temperature, bucketed in a uniform 3-D grid of cells over the unit sphere, so
 * a pixel finds the stars within a few kernel widths of its sky direction by
 * visiting at most 8 cells.
 */
import type { StarCatalogue } from './starCatalogue';
import { colourIndexOfLog } from './colourTable';

/** Cell edge in unit-vector space; about 1.15 degrees on the sphere. */
export const STAR_CELL_SIZE = 0.02;
const CELLS_PER_AXIS = Math.ceil(2 / STAR_CELL_SIZE) + 1;
/** Floats per star in StarField.packed. */
export const STAR_STRIDE = 5;
/** B-V used where the catalogue gives none: the Sun's 0.65 (value from memory). */
export const DEFAULT_BV = 0.65;

/** Stars sorted by grid cell; arrays share the star index. */
export interface StarField {
  count: number;
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  /** Flux in units of a magnitude-0 star, 10^(-0.4 m) (Pogson 1856). */
  flux: Float64Array;
  /** Blackbody temperature, K. */
  temperatureK: Float64Array;
  /** ln of the temperature in K. */
  logTemperature: Float64Array;
  /**
   * The per-pixel star loop's data in one array, STAR_STRIDE floats per star (same order):
   * x, y, z, flux, colour-table index of the temperature (colourTable.ts).
   */
  packed: Float64Array;
  /** cellStart[c]..cellStart[c+1] are the stars of cell c. */
  cellStart: Int32Array;
}

/** Grid cell index of a unit vector component (-1..1). */
function cellCoord(v: number): number {
  return Math.floor((v + 1) / STAR_CELL_SIZE);
}

/**
 * Build the star field from a catalogue.
 * @param cat star catalogue (J2000 degrees, magnitudes, B-V)
 * @param magnitudeLimit faintest magnitude kept
 * @param temperatureFromBv B-V index to blackbody temperature in K (physics.md section 6)
 * @returns stars bucketed by cell
 */
export function buildStarField(cat: StarCatalogue, magnitudeLimit: number, temperatureFromBv: (bv: number) => number): StarField {
  if (!Number.isFinite(magnitudeLimit)) throw new RangeError('magnitudeLimit: finite magnitude');
  const idx: number[] = [];
  for (let i = 0; i < cat.count; i++) if (cat.mag[i] <= magnitudeLimit) idx.push(i);
  const n = idx.length;
  const cellOf = new Int32Array(n);
  const ux = new Float64Array(n);
  const uy = new Float64Array(n);
  const uz = new Float64Array(n);
  idx.forEach((i, k) => {
    const ra = (cat.raDeg[i] * Math.PI) / 180;
    const dec = (cat.decDeg[i] * Math.PI) / 180;
    ux[k] = Math.cos(dec) * Math.cos(ra);
    uy[k] = Math.cos(dec) * Math.sin(ra);
    uz[k] = Math.sin(dec);
    cellOf[k] = (cellCoord(ux[k]) * CELLS_PER_AXIS + cellCoord(uy[k])) * CELLS_PER_AXIS + cellCoord(uz[k]);
  });
  const cellCount = CELLS_PER_AXIS ** 3;
  const cellStart = new Int32Array(cellCount + 1);
  for (let k = 0; k < n; k++) cellStart[cellOf[k] + 1]++;
  for (let c = 0; c < cellCount; c++) cellStart[c + 1] += cellStart[c];
  const fill = cellStart.slice(0, cellCount);
  const field: StarField = {
    count: n,
    x: new Float64Array(n),
    y: new Float64Array(n),
    z: new Float64Array(n),
    flux: new Float64Array(n),
    temperatureK: new Float64Array(n),
    logTemperature: new Float64Array(n),
    packed: new Float64Array(n * STAR_STRIDE),
    cellStart,
  };
  // stable order within a cell (catalogue order) keeps sums, and so bytes, reproducible
  for (let k = 0; k < n; k++) {
    const slot = fill[cellOf[k]]++;
    const i = idx[k];
    field.x[slot] = ux[k];
    field.y[slot] = uy[k];
    field.z[slot] = uz[k];
    field.flux[slot] = Math.pow(10, -0.4 * cat.mag[i]); // Pogson: m = -2.5 log10(F / F0)
    const bv = Number.isFinite(cat.bv[i]) ? cat.bv[i] : DEFAULT_BV;
    field.temperatureK[slot] = temperatureFromBv(bv);
    field.logTemperature[slot] = Math.log(field.temperatureK[slot]);
    const o = slot * STAR_STRIDE;
    field.packed[o] = ux[k];
    field.packed[o + 1] = uy[k];
    field.packed[o + 2] = uz[k];
    field.packed[o + 3] = field.flux[slot];
    field.packed[o + 4] = colourIndexOfLog(field.logTemperature[slot]);
  }
  return field;
}

/**
 * Visit the stars whose cells overlap a ball around a unit vector.
 * @param field star field
 * @param dx hole-frame unit vector x
 * @param dy unit vector y
 * @param dz unit vector z
 * @param chord ball radius in unit-vector (chord) distance, at most STAR_CELL_SIZE
 * @param visit called with each candidate star index (may be outside the ball)
 */
export function forEachStarNear(
  field: StarField,
  dx: number,
  dy: number,
  dz: number,
  chord: number,
  visit: (star: number) => void,
): void {
  const n = CELLS_PER_AXIS;
  const x0 = cellCoord(dx - chord);
  const x1 = cellCoord(dx + chord);
  const y0 = cellCoord(dy - chord);
  const y1 = cellCoord(dy + chord);
  const z0 = cellCoord(dz - chord);
  const z1 = cellCoord(dz + chord);
  const start = field.cellStart;
  for (let ix = x0; ix <= x1; ix++) {
    if (ix < 0 || ix >= n) continue;
    for (let iy = y0; iy <= y1; iy++) {
      if (iy < 0 || iy >= n) continue;
      const base = (ix * n + iy) * n;
      const lo = Math.max(0, z0);
      const hi = Math.min(n - 1, z1);
      const a = start[base + lo];
      const b = start[base + hi + 1];
      for (let s = a; s < b; s++) visit(s);
    }
  }
}

/**
 * Deposit the stars' light into an equirectangular map (layout of milkyWay.ts)
 * as surface brightness, for pixels whose sky footprint is too large to sum
 * stars one by one.
 * @param field star field
 * @param width map width (texels), >= 2
 * @param height map height (texels), >= 1
 * @returns 2 channels per texel: flux per steradian (mag-0 units), and flux * temperature per steradian (K)
 */
export function depositStarLight(field: StarField, width: number, height: number): Float32Array {
  const out = new Float32Array(width * height * 2);
  for (let s = 0; s < field.count; s++) {
    const ra = Math.atan2(field.y[s], field.x[s]);
    const dec = Math.asin(Math.max(-1, Math.min(1, field.z[s])));
    let u = ra / (2 * Math.PI);
    u -= Math.floor(u);
    const c = Math.min(width - 1, Math.floor(u * width));
    const r = Math.min(height - 1, Math.floor(((Math.PI / 2 - dec) / Math.PI) * height));
    // texel solid angle: dRA * (sin(top) - sin(bottom))
    const top = Math.PI / 2 - (r / height) * Math.PI;
    const bottom = Math.PI / 2 - ((r + 1) / height) * Math.PI;
    const omega = ((2 * Math.PI) / width) * (Math.sin(top) - Math.sin(bottom));
    out[(r * width + c) * 2] += field.flux[s] / omega;
    out[(r * width + c) * 2 + 1] += (field.flux[s] * field.temperatureK[s]) / omega;
  }
  return out;
}

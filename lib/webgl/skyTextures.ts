/**
 * Sky data in GPU form, built once per catalogue and magnitude limit (not per
 * frame): the stars as float textures in lib/render's cell order (position and
 * flux in one texture, log temperature in another, so the shifted colour is
 * computed per pixel from g and the blackbody texture), the cell index, the
 * diffuse map (Milky Way brightness, star flux per sr, star flux x K per sr)
 * with lib/render's own box-filtered mip pyramid, and the blackbody colour
 * table. Mirrors lib/render/frame.ts prepareFrame.
 */
import type { StarCatalogue } from '../render/starCatalogue';
import { buildStarField, depositStarLight, STAR_CELL_SIZE, type StarField } from '../render/starField';
import { buildSkyMipMap } from '../render/skyMap';
import { buildColourTable, COLOUR_TABLE_MAX_K, COLOUR_TABLE_MIN_K } from '../render/colourTable';
import { engineBlackbodyLinearSrgb, engineTemperatureFromBv } from '../render/engine';

/** Texture width used for every 1-D array laid out in 2-D, texels. */
export const DATA_TEXTURE_WIDTH = 1024;
/** Cells per axis of lib/render's star grid. */
export const STAR_CELLS_PER_AXIS = Math.ceil(2 / STAR_CELL_SIZE) + 1;
/** Diffuse map size, texels (lib/render/frame.ts STAR_LIGHT_MAP_*). */
export const DIFFUSE_MAP_WIDTH = 1024;
export const DIFFUSE_MAP_HEIGHT = 512;

/** A 2-D float texture's data. */
export interface FloatImage {
  width: number;
  height: number;
  /** `channels` floats per texel, row-major */
  data: Float32Array;
  channels: 1 | 4;
}

/** Star textures. */
export interface StarTextures {
  count: number;
  /** (x, y, z, flux in mag-0 units) per star, hole frame */
  positionFlux: FloatImage;
  /** ln(T / 1 K) per star */
  logTemperature: FloatImage;
  /** cellStart of lib/render's StarField (stars of cell c are cellStart[c]..cellStart[c+1]) */
  cellStart: FloatImage;
  /** most stars in any z-run of three cells (bounds the shader's loop) */
  maxRun: number;
  /** the field itself (for the CPU side) */
  field: StarField;
}

function layout1d(length: number, channels: 1 | 4): FloatImage {
  const height = Math.max(1, Math.ceil(length / DATA_TEXTURE_WIDTH));
  return { width: DATA_TEXTURE_WIDTH, height, channels, data: new Float32Array(DATA_TEXTURE_WIDTH * height * channels) };
}

/**
 * Star textures of a catalogue (lib/render buildStarField order and values).
 * @param catalogue decoded star catalogue
 * @param magnitudeLimit faintest magnitude kept (-2..8.5)
 * @returns textures
 * @throws RangeError for a non-finite limit
 */
export function buildStarTextures(catalogue: StarCatalogue, magnitudeLimit: number): StarTextures {
  if (!Number.isFinite(magnitudeLimit)) throw new RangeError('magnitudeLimit: finite magnitude (-2..8.5)');
  const field = buildStarField(catalogue, magnitudeLimit, engineTemperatureFromBv);
  const n = field.count;
  const positionFlux = layout1d(Math.max(1, n), 4);
  const logTemperature = layout1d(Math.max(1, n), 1);
  for (let i = 0; i < n; i++) {
    positionFlux.data.set([field.x[i], field.y[i], field.z[i], field.flux[i]], 4 * i);
    logTemperature.data[i] = field.logTemperature[i];
  }
  const cellStart = layout1d(field.cellStart.length, 1);
  cellStart.data.set(field.cellStart);
  let maxRun = 0;
  const c = STAR_CELLS_PER_AXIS;
  for (let column = 0; column < c * c; column++) {
    for (let z = 0; z + 2 < c; z++) {
      const run = field.cellStart[column * c + z + 3] - field.cellStart[column * c + z];
      if (run > maxRun) maxRun = run;
    }
  }
  return { count: n, positionFlux, logTemperature, cellStart, maxRun, field };
}

/** Diffuse sky map with mip levels (RGBA: Milky Way, star flux per sr, star flux x K per sr, 0). */
export interface DiffuseTextures {
  levels: FloatImage[];
  /** angular height of one level-0 texel, radians */
  texelRad: number;
}

/**
 * Diffuse map and its mip pyramid (lib/render buildSkyMipMap: 2x2 box averages).
 * @param milkyWay Milky Way brightness map (1024 x 512, mag-0 fluxes per sr), or null
 * @param stars star textures whose light is deposited into the map, or null
 * @returns levels from 1024 x 512 down to 2 x 1
 * @throws RangeError if the Milky Way map has another size
 */
export function buildDiffuseTextures(milkyWay: { width: number; height: number; data: Float32Array } | null, stars: StarTextures | null): DiffuseTextures {
  const w = DIFFUSE_MAP_WIDTH;
  const h = DIFFUSE_MAP_HEIGHT;
  if (milkyWay && (milkyWay.width !== w || milkyWay.height !== h)) throw new RangeError(`milkyWay: must be ${w} x ${h} texels`);
  const light = stars ? depositStarLight(stars.field, w, h) : null;
  const data = new Float32Array(w * h * 3);
  for (let i = 0; i < w * h; i++) {
    data[3 * i] = milkyWay ? milkyWay.data[i] : 0;
    data[3 * i + 1] = light ? light[2 * i] : 0;
    data[3 * i + 2] = light ? light[2 * i + 1] : 0;
  }
  const mip = buildSkyMipMap(data, w, h, 3);
  const levels: FloatImage[] = mip.levels.map((level) => {
    const rgba = new Float32Array(level.width * level.height * 4);
    for (let i = 0; i < level.width * level.height; i++) {
      rgba[4 * i] = level.data[3 * i];
      rgba[4 * i + 1] = level.data[3 * i + 1];
      rgba[4 * i + 2] = level.data[3 * i + 2];
    }
    return { width: level.width, height: level.height, data: rgba, channels: 4 as const };
  });
  return { levels, texelRad: mip.texelRad };
}

/** Blackbody colour texture: unit-luminance linear sRGB against ln T, one row. */
export interface ColourTexture {
  image: FloatImage;
  logMinK: number;
  logSpan: number;
}

/**
 * The blackbody colour table of lib/render (CIE 1931, sRGB; physics.md section 6) as an RGBA texture row.
 * @returns texture data and its log-temperature mapping
 */
export function buildColourTexture(): ColourTexture {
  const table = buildColourTable(engineBlackbodyLinearSrgb);
  const entries = table.rgb.length / 3;
  const data = new Float32Array(entries * 4);
  for (let i = 0; i < entries; i++) {
    data[4 * i] = table.rgb[3 * i];
    data[4 * i + 1] = table.rgb[3 * i + 1];
    data[4 * i + 2] = table.rgb[3 * i + 2];
    data[4 * i + 3] = 1;
  }
  const logMinK = Math.log(COLOUR_TABLE_MIN_K);
  return { image: { width: entries, height: 1, data, channels: 4 }, logMinK, logSpan: Math.log(COLOUR_TABLE_MAX_K) - logMinK };
}

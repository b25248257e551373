/**
 * Sky data in GPU form, built once per catalogue and magnitude limit (not per
 * frame): the stars as cube-map tile lists (starTiles.ts; position, flux and
 * log temperature per entry, so the shifted colour is computed per pixel from
 * g and the blackbody texture), the diffuse map (Milky Way brightness, star
 * flux per sr, star flux x K per sr) with lib/render's own box-filtered mip
 * pyramid, and the blackbody colour table. Mirrors lib/render/frame.ts prepareFrame.
 */
import type { StarCatalogue } from '../render/starCatalogue';
import { buildStarField, depositStarLight, type StarField } from '../render/starField';
import { buildSkyMipMap } from '../render/skyMap';
import { buildColourTable, COLOUR_TABLE_MAX_K, COLOUR_TABLE_MIN_K } from '../render/colourTable';
import { engineBlackbodyLinearSrgb, engineTemperatureFromBv } from '../render/engine';
import { buildStarTileIndex, type StarTileIndex } from './starTiles';

/** Diffuse map size, texels (lib/render/frame.ts STAR_LIGHT_MAP_*). */
export const DIFFUSE_MAP_WIDTH = 1024;
export const DIFFUSE_MAP_HEIGHT = 512;

/** A 2-D float texture's data. */
export interface FloatImage {
  width: number;
  height: number;
  /** `channels` floats per texel, row-major */
  data: Float32Array;
  channels: 1 | 2 | 4;
}

/** Star textures. */
export interface StarTextures {
  count: number;
  /** the cube-map tile lists the shader's star loop reads (starTiles.ts) */
  tiles: StarTileIndex;
  /** the field itself (for the CPU side) */
  field: StarField;
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
  return { count: field.count, tiles: buildStarTileIndex(field), field };
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

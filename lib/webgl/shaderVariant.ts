/**
 * Compile-time switches of the sky shaders (shaders/sky.common.glsl and
 * sky.lensed.frag): which projection, whether lensing and the camera boost
 * apply, how many samples, which tone map, which grids and sky sources. Each
 * combination is compiled as its own program, so a pixel never pays for code
 * of a setting that is off. That matters most in software WebGL (SwiftShader),
 * which runs both sides of every branch under a lane mask; a hardware GPU
 * gains a smaller, simpler program. Settings that change every frame (camera,
 * exposure, gains) stay uniforms, so moving the camera never recompiles.
 */
import type { GpuFrame } from './gpuFrame';
import { FATE_FAR_SIDE, FATE_HORIZON } from '../relativity';
import { PROJECTION_CODES } from './projectionConstants';

/** #define name -> integer value. */
export type ShaderDefines = Record<string, number>;

/** What a frame draws besides its GpuFrame settings. */
export interface LensedVariantInputs {
  /** "where the light comes from" mode: the celestial grid is drawn */
  sourcesMode: boolean;
  /** star catalogue on and its textures bound */
  stars: boolean;
  /** diffuse map (Milky Way and far-star light) bound */
  diffuse: boolean;
  /** Milky Way on and present in the diffuse map */
  milkyWay: boolean;
  /** uniform sky brightness, mag-0 fluxes per steradian (0 or less: off) */
  uniformBrightness: number;
}

/**
 * Switches of sky.common.glsl (shared by both programs).
 * @param frame per-frame GPU inputs (lib/webgl prepareGpuFrame)
 * @returns PROJECTION (lib/webgl PROJECTION_CODES), LENSING and BOOST (0 or 1)
 * @throws RangeError for a projection code outside 0..3
 */
export function directionsShaderDefines(frame: GpuFrame): ShaderDefines {
  const kind = frame.projection.kind;
  if (!Number.isInteger(kind) || kind < 0 || kind > 3) throw new RangeError(`frame.projection.kind must be a projection code 0..3; got ${kind}`);
  const v = frame.boostVelocity;
  const moving = v[0] !== 0 || v[1] !== 0 || v[2] !== 0;
  return { PROJECTION: kind, LENSING: frame.lensing ? 1 : 0, BOOST: frame.lensing && moving ? 1 : 0 };
}

/** True when some ray of the frame can end with this fate (a segment of the packed ray table has it). */
function fateOccurs(frame: GpuFrame, fate: number): boolean {
  const table = frame.table;
  if (!frame.lensing || !table) return false;
  for (let k = 0; k < table.segmentCount; k++) if (table.segmentA[4 * k + 3] === fate) return true;
  return false;
}

/**
 * Switches of sky.lensed.frag.
 * @param frame per-frame GPU inputs (lib/webgl prepareGpuFrame)
 * @param inputs mode and sky sources in use
 * @returns the common switches plus SAMPLES (1..4), TONE_MAP (lib/webgl TONE_MAP_CODES), and 0 or 1:
 *   HORIZON_GRID and FAR_SIDE_GRID (enabled, and rays of the frame end on the horizon (fate 1) or the far
 *   side (fate 2; only inside the horizon, physics.md section 5)), DASHED_GRIDS (one of those is dashed),
 *   CELESTIAL_GRID, STARS, DIFFUSE, MILKY_WAY, UNIFORM_SKY
 * @throws RangeError for supersampling outside 1..4 or a tone-map code outside 0..2
 */
export function lensedShaderDefines(frame: GpuFrame, inputs: LensedVariantInputs): ShaderDefines {
  if (!Number.isInteger(frame.supersampling) || frame.supersampling < 1 || frame.supersampling > 4) {
    throw new RangeError(`frame.supersampling must be an integer 1..4; got ${frame.supersampling}`);
  }
  if (!Number.isInteger(frame.toneMap) || frame.toneMap < 0 || frame.toneMap > 2) throw new RangeError(`frame.toneMap must be a tone-map code 0..2; got ${frame.toneMap}`);
  const horizon = frame.horizonGrid.enabled && fateOccurs(frame, FATE_HORIZON);
  const farSide = frame.farSideGrid.enabled && fateOccurs(frame, FATE_FAR_SIDE);
  return {
    ...directionsShaderDefines(frame),
    SAMPLES: frame.supersampling,
    TONE_MAP: frame.toneMap,
    HORIZON_GRID: horizon ? 1 : 0,
    FAR_SIDE_GRID: farSide ? 1 : 0,
    DASHED_GRIDS: (horizon && frame.horizonGrid.dashed) || (farSide && frame.farSideGrid.dashed) ? 1 : 0,
    CELESTIAL_GRID: inputs.sourcesMode ? 1 : 0,
    STARS: inputs.stars ? 1 : 0,
    DIFFUSE: inputs.diffuse ? 1 : 0,
    MILKY_WAY: inputs.diffuse && inputs.milkyWay ? 1 : 0,
    UNIFORM_SKY: inputs.uniformBrightness > 0 ? 1 : 0,
  };
}

/**
 * Whether drawing the frame by fate tiles (lib/webgl/fateTiles.ts) saves work: some of its rays end on r = 2M,
 * or it is a dome master, whose corners lie outside the image circle.
 * @param frame per-frame GPU inputs (lensing on, with its ray table)
 */
export function fateTilesPay(frame: GpuFrame): boolean {
  if (!frame.lensing || !frame.table) return false;
  return fateOccurs(frame, FATE_HORIZON) || fateOccurs(frame, FATE_FAR_SIDE) || frame.projection.kind === PROJECTION_CODES.dome;
}

/**
 * Switches of the lensed program for tiles whose rays all reach the sky (no horizon or far-side grid code), for
 * interior sky tiles (the same, with the geometry interpolated from sky.geometry.frag's grid; picture mode only,
 * as the celestial grid needs each pixel's own derivatives) and for tiles whose rays all end on r = 2M (no sky
 * sources, no celestial grid); the full set serves mixed tiles.
 * @param full lensedShaderDefines of the frame
 */
export function tileShaderDefines(full: ShaderDefines): { sky: ShaderDefines; interior: ShaderDefines; surface: ShaderDefines } {
  const sky = { ...full, HORIZON_GRID: 0, FAR_SIDE_GRID: 0, DASHED_GRIDS: 0 };
  return {
    sky,
    interior: { ...sky, INTERPOLATED_GEOMETRY: 1 },
    surface: { ...full, STARS: 0, DIFFUSE: 0, MILKY_WAY: 0, UNIFORM_SKY: 0, CELESTIAL_GRID: 0 },
  };
}

/**
 * A stable key of a set of switches (for a cache of compiled programs).
 * @param defines switches
 * @returns "NAME=value" pairs sorted by name, joined by ";"
 */
export function shaderVariantKey(defines: ShaderDefines): string {
  return Object.keys(defines)
    .sort()
    .map((k) => `${k}=${defines[k]}`)
    .join(';');
}

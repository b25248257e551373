/**
 * Blackbody chromaticity table for the per-pixel path: linear sRGB of a
 * Planckian radiator at temperature T, scaled to unit luminance (Y = 1), tabulated
 * in log T so that shifting T -> g T (physics.md section 6) costs one lookup.
 * The colour science itself (CIE 1931 matching functions, sRGB primaries) lives
 * in lib/relativity; this file only samples it.
 */

/** Coldest temperature tabulated, K; colder light keeps this colour. */
export const COLOUR_TABLE_MIN_K = 300;
/** Hottest temperature tabulated, K; hotter light keeps this colour (the Rayleigh-Jeans limit is reached long before). */
export const COLOUR_TABLE_MAX_K = 1e7;
/** Number of table entries (log-spaced in temperature). */
export const COLOUR_TABLE_ENTRIES = 2048;
const ENTRIES = COLOUR_TABLE_ENTRIES;
const LOG_MIN = Math.log(COLOUR_TABLE_MIN_K);
const LOG_SPAN = Math.log(COLOUR_TABLE_MAX_K) - LOG_MIN;
/** Table entries per unit of ln T: a shift T -> g T moves a colour's index by ln(g) times this. */
export const COLOUR_INDEX_PER_LOG = (ENTRIES - 1) / LOG_SPAN;

/** Linear sRGB of a blackbody, luminance-normalised, in log-temperature steps. */
export interface ColourTable {
  rgb: Float32Array;
}

/**
 * Tabulate a blackbody colour function.
 * @param blackbodyLinearSrgb temperature in K to linear sRGB (any scale; Y is normalised here)
 * @returns the table
 */
export function buildColourTable(blackbodyLinearSrgb: (temperatureK: number) => ArrayLike<number>): ColourTable {
  const rgb = new Float32Array(ENTRIES * 3);
  for (let i = 0; i < ENTRIES; i++) {
    const t = Math.exp(LOG_MIN + (i / (ENTRIES - 1)) * LOG_SPAN);
    const c = blackbodyLinearSrgb(t);
    // Rec. 709 / sRGB luminance weights (IEC 61966-2-1)
    const y = 0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2];
    const s = y > 0 ? 1 / y : 0;
    rgb[3 * i] = Math.max(0, c[0] * s);
    rgb[3 * i + 1] = Math.max(0, c[1] * s);
    rgb[3 * i + 2] = Math.max(0, c[2] * s);
  }
  return { rgb };
}

/**
 * Unit-luminance linear sRGB of a blackbody at temperatureK (clamped to the table).
 * @param table colour table
 * @param temperatureK K, > 0
 * @param out receives r, g, b
 * @returns out
 */
export function blackbodyColour(table: ColourTable, temperatureK: number, out: Float64Array): Float64Array {
  return blackbodyColourLog(table, Math.log(temperatureK), out);
}

/**
 * As blackbodyColour, from the natural log of the temperature (saves a log per star in the pixel loop).
 * @param table colour table
 * @param logTemperature ln(T / 1 K)
 * @param out receives r, g, b
 * @returns out
 */
export function blackbodyColourLog(table: ColourTable, logTemperature: number, out: Float64Array): Float64Array {
  return blackbodyColourAtIndex(table, colourIndexOfLog(logTemperature), out);
}

/**
 * Fractional table index of a temperature (not clamped), so per-star indices can be precomputed
 * and a frequency shift g added as ln(g) * COLOUR_INDEX_PER_LOG.
 * @param logTemperature ln(T / 1 K)
 * @returns index, 0 at COLOUR_TABLE_MIN_K and COLOUR_TABLE_ENTRIES - 1 at COLOUR_TABLE_MAX_K
 */
export function colourIndexOfLog(logTemperature: number): number {
  return (logTemperature - LOG_MIN) * COLOUR_INDEX_PER_LOG;
}

/**
 * Unit-luminance linear sRGB at a fractional table index (clamped to the table), linear interpolation.
 * @param table colour table
 * @param index fractional index from colourIndexOfLog (plus any shift)
 * @param out receives r, g, b
 * @returns out
 */
export function blackbodyColourAtIndex(table: ColourTable, index: number, out: Float64Array): Float64Array {
  let x = index;
  if (!(x > 0)) x = 0;
  if (x > ENTRIES - 1) x = ENTRIES - 1;
  const i = Math.min(ENTRIES - 2, Math.floor(x));
  const f = x - i;
  const t = table.rgb;
  out[0] = t[3 * i] + f * (t[3 * i + 3] - t[3 * i]);
  out[1] = t[3 * i + 1] + f * (t[3 * i + 4] - t[3 * i + 1]);
  out[2] = t[3 * i + 2] + f * (t[3 * i + 5] - t[3 * i + 2]);
  return out;
}

/**
 * Exposure, tone mapping and sRGB encoding: the explicit, recorded steps that
 * turn sky radiance (mag-0 star fluxes per steradian) into display values
 * (physics.md section 6: brightness is unbounded near the horizon, so these are
 * never silent).
 */

/** Display value 1 at ev = 0 corresponds to this surface brightness, mag-0 fluxes per steradian (Skywell's choice). */
export const EXPOSURE_REFERENCE_PER_SR = 1000;

export type ToneMapOperator = 'none' | 'reinhard' | 'exponential';

/**
 * Linear scale of an exposure setting.
 * @param ev exposure in stops, -60..60
 * @returns multiplier from radiance (mag-0 fluxes per sr) to display-linear units
 */
export function exposureScale(ev: number): number {
  if (!Number.isFinite(ev) || ev < -60 || ev > 60) throw new RangeError('ev: -60..60 stops');
  return Math.pow(2, ev) / EXPOSURE_REFERENCE_PER_SR;
}

/**
 * Tone-map one display-linear colour in place.
 * 'none' passes values through (clipped only when encoded); 'reinhard' maps
 * luminance L to L / (1 + L), keeping hue (Reinhard et al. 2002, SIGGRAPH,
 * eq. 3); 'exponential' maps each channel c to 1 - exp(-c) (photographic film
 * response, common practice), which whitens very bright cores.
 * @param rgb display-linear colour at offset `at` (3 floats), modified in place
 * @param at index of the red component
 * @param op operator
 */
export function toneMapInPlace(rgb: Float32Array | Float64Array, at: number, op: ToneMapOperator): void {
  if (op === 'none') return;
  const r = rgb[at];
  const g = rgb[at + 1];
  const b = rgb[at + 2];
  if (op === 'reinhard') {
    const lum = 0.2126 * r + 0.7152 * g + 0.0722 * b;
    const s = 1 / (1 + lum);
    rgb[at] = r * s;
    rgb[at + 1] = g * s;
    rgb[at + 2] = b * s;
    return;
  }
  rgb[at] = 1 - Math.exp(-r);
  rgb[at + 1] = 1 - Math.exp(-g);
  rgb[at + 2] = 1 - Math.exp(-b);
}

/**
 * sRGB transfer function (IEC 61966-2-1): linear 0..1 to encoded 0..1, clipped.
 * @param linear display-linear value
 * @returns encoded value in 0..1
 */
export function srgbEncode(linear: number): number {
  if (!(linear > 0)) return 0;
  if (linear >= 1) return 1;
  return linear <= 0.0031308 ? 12.92 * linear : 1.055 * Math.pow(linear, 1 / 2.4) - 0.055;
}

const LUT8_SIZE = 65536;
let lut8: Uint8Array | null = null;

/**
 * The 8-bit sRGB code table behind srgbEncode8: entry i is the code of linear value i / 65535.
 * @returns 65536 codes (built on first use, then shared)
 */
export function srgbLut8(): Uint8Array {
  if (lut8 === null) {
    const table = new Uint8Array(LUT8_SIZE);
    for (let i = 0; i < LUT8_SIZE; i++) table[i] = Math.round(255 * srgbEncode(i / (LUT8_SIZE - 1)));
    lut8 = table;
  }
  return lut8;
}

/** 8-bit sRGB code of a display-linear value via a 65536-entry table (exact to the code value except at rounding ties). */
export function srgbEncode8(linear: number): number {
  const table = lut8 ?? srgbLut8();
  if (!(linear > 0)) return 0;
  if (linear >= 1) return 255;
  return table[Math.round(linear * (LUT8_SIZE - 1))];
}

/**
 * Encoded sRGB at linear values i / 65536, for srgbEncode16's interpolation: the curve's second
 * derivative keeps the linear-interpolation error below 0.005 of a 16-bit code (largest just above
 * the 0.0031308 knee), so codes equal direct rounding except within 0.005 of a tie.
 */
const LUT16_STEPS = 65536;
let lut16: Float64Array | null = null;

function srgbLut16(): Float64Array {
  if (lut16 === null) {
    const table = new Float64Array(LUT16_STEPS + 1);
    for (let i = 0; i <= LUT16_STEPS; i++) table[i] = srgbEncode(i / LUT16_STEPS);
    lut16 = table;
  }
  return lut16;
}

/** 16-bit sRGB code of a display-linear value (table interpolation, no Math.pow per sample). */
export function srgbEncode16(linear: number): number {
  const table = lut16 ?? srgbLut16();
  if (!(linear > 0)) return 0;
  if (linear >= 1) return 65535;
  const x = linear * LUT16_STEPS;
  const i = Math.floor(x);
  const v = table[i] + (x - i) * (table[i + 1] - table[i]);
  return Math.round(65535 * v);
}

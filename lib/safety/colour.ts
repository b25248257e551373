/**
 * Colour measures of the photosensitivity check: sRGB decoding, relative
 * luminance (WCAG 2.2), CIE 1976 u'v' chromaticity and the red ratio.
 * All functions take linear sRGB components in 0..1 unless they say otherwise.
 */

/**
 * sRGB decoding breakpoint of the encoded value. WCAG 2.2's "relative luminance"
 * text prints 0.03928 (from an early sRGB draft); IEC 61966-2-1:1999 uses 0.04045.
 * The two differ only for encoded values between them (below 1/255 of a
 * difference in the result); we follow the IEC standard.
 */
export const SRGB_DECODE_BREAKPOINT = 0.04045;

/** Weight of linear red in relative luminance (Rec. 709 / sRGB, IEC 61966-2-1; WCAG 2.2 "relative luminance"). */
export const LUMINANCE_WEIGHT_R = 0.2126;
/** Weight of linear green in relative luminance (same sources). */
export const LUMINANCE_WEIGHT_G = 0.7152;
/** Weight of linear blue in relative luminance (same sources). */
export const LUMINANCE_WEIGHT_B = 0.0722;

function checkRgb(r: number, g: number, b: number): void {
  if (!(Number.isFinite(r) && Number.isFinite(g) && Number.isFinite(b))) throw new RangeError('r, g, b: finite linear values (0..1)');
}

// Linear sRGB -> CIE XYZ (D65), IEC 61966-2-1:1999 section 5.2 (rows X, Y, Z).
const M_XR = 0.4124, M_XG = 0.3576, M_XB = 0.1805;
const M_YR = 0.2126, M_YG = 0.7152, M_YB = 0.0722;
const M_ZR = 0.0193, M_ZG = 0.1192, M_ZB = 0.9505;

/**
 * Decode one sRGB-encoded component to linear light.
 * @param encoded sRGB-encoded value, 0..1 (values outside are clipped, as a display clips them)
 * @returns linear value, 0..1 (IEC 61966-2-1:1999 eq. for the inverse transfer function)
 * @throws RangeError for a non-finite value
 */
export function srgbToLinear(encoded: number): number {
  if (!Number.isFinite(encoded)) throw new RangeError('encoded: a finite sRGB value, 0..1');
  const c = encoded <= 0 ? 0 : encoded >= 1 ? 1 : encoded;
  return c <= SRGB_DECODE_BREAKPOINT ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}

/**
 * Relative luminance of a linear sRGB colour (WCAG 2.2 definition "relative luminance").
 * @param r linear red, 0..1
 * @param g linear green, 0..1
 * @param b linear blue, 0..1
 * @returns relative luminance, 0 (black) .. 1 (white)
 */
export function relativeLuminance(r: number, g: number, b: number): number {
  checkRgb(r, g, b);
  return LUMINANCE_WEIGHT_R * r + LUMINANCE_WEIGHT_G * g + LUMINANCE_WEIGHT_B * b;
}

/**
 * Relative luminance of an sRGB-encoded colour (WCAG 2.2, with the IEC breakpoint).
 * @param r encoded red, 0..1 (8-bit value / 255)
 * @param g encoded green, 0..1
 * @param b encoded blue, 0..1
 * @returns relative luminance, 0..1
 */
export function relativeLuminanceSrgb(r: number, g: number, b: number): number {
  return relativeLuminance(srgbToLinear(r), srgbToLinear(g), srgbToLinear(b));
}

/** CIE 1976 u'v' of D65 white computed from the IEC matrix rows summed (X, Y, Z of R = G = B = 1). */
const WHITE_X = M_XR + M_XG + M_XB;
const WHITE_Y = M_YR + M_YG + M_YB;
const WHITE_Z = M_ZR + M_ZG + M_ZB;
const WHITE_DEN = WHITE_X + 15 * WHITE_Y + 3 * WHITE_Z;
/** u' of D65 white (about 0.1978), used for black, which has no chromaticity of its own. */
export const D65_U = (4 * WHITE_X) / WHITE_DEN;
/** v' of D65 white (about 0.4683). */
export const D65_V = (9 * WHITE_Y) / WHITE_DEN;

/**
 * CIE 1976 UCS chromaticity u'v' of a linear sRGB colour, through XYZ with the
 * IEC 61966-2-1 matrix; u' = 4X / (X + 15Y + 3Z), v' = 9Y / (X + 15Y + 3Z) (CIE 15:2004).
 * Black (no light) is given D65 white's chromaticity: achromatic, so that a
 * change between black and a saturated red is a change of chromaticity.
 * @param out receives [u', v'] (unitless)
 * @param r linear red, >= 0
 * @param g linear green, >= 0
 * @param b linear blue, >= 0
 * @returns out
 */
export function linearRgbToUv(out: Float64Array, r: number, g: number, b: number): Float64Array {
  checkRgb(r, g, b);
  const x = M_XR * r + M_XG * g + M_XB * b;
  const y = M_YR * r + M_YG * g + M_YB * b;
  const z = M_ZR * r + M_ZG * g + M_ZB * b;
  const den = x + 15 * y + 3 * z;
  if (!(den > 1e-12)) {
    out[0] = D65_U;
    out[1] = D65_V;
  } else {
    out[0] = (4 * x) / den;
    out[1] = (9 * y) / den;
  }
  return out;
}

/**
 * Red ratio R/(R+G+B) of a linear sRGB colour (WCAG 2.2 note on red flashes: R, G, B
 * "as specified in the relative luminance definition", i.e. linearised).
 * @param r linear red, >= 0
 * @param g linear green, >= 0
 * @param b linear blue, >= 0
 * @returns 0..1; 0 for black
 */
export function redRatio(r: number, g: number, b: number): number {
  checkRgb(r, g, b);
  const sum = r + g + b;
  return sum > 1e-12 ? r / sum : 0;
}

/**
 * Table decoding every 8-bit or 16-bit sRGB code to linear light.
 * @param levels number of codes: 256 for 8-bit, 65536 for 16-bit (and for floats, quantised to 16 bits)
 * @returns Float32Array of linear values, index = code
 */
export function buildSrgbDecodeTable(levels: number): Float32Array {
  if (!Number.isInteger(levels) || levels < 2 || levels > 65536) throw new RangeError('levels: integer 2..65536');
  const table = new Float32Array(levels);
  for (let i = 0; i < levels; i++) table[i] = srgbToLinear(i / (levels - 1));
  return table;
}

/**
 * Star colour: B-V to temperature, blackbody to linear sRGB through the CIE 1931
 * 2-degree colour matching functions, and the shifted colour and brightness of
 * a star seen with frequency shift g (physics.md section 6).
 *
 * CMFs: the multi-lobe piecewise-Gaussian fit of Wyman, Sloan & Shirley 2013,
 * "Simple Analytic Approximations to the CIE XYZ Color Matching Functions",
 * JCGT 2(2), 1-11 (their 1931 fit; coefficients as published, inverse widths).
 * Normalisation: colours are scaled to luminance Y = 1 (brightness is carried
 * separately), then clipped at 0 for out-of-gamut (negative) components.
 */
import { requireAbove, requireFinite } from './validate';

/** Planck's second radiation constant hc/k_B in m K (CODATA 2018, exact from SI). */
const SECOND_RADIATION_CONSTANT_M_K = 1.438776877e-2;
const WAVELENGTH_MIN_NM = 360;
const WAVELENGTH_MAX_NM = 830;

function lobe(lambdaNm: number, mean: number, invLeft: number, invRight: number): number {
  const t = (lambdaNm - mean) * (lambdaNm < mean ? invLeft : invRight);
  return Math.exp(-0.5 * t * t);
}

/**
 * CIE 1931 2-degree colour matching functions, analytic multi-lobe fit.
 * @param out [xbar, ybar, zbar] written
 * @param lambdaNm wavelength in nm
 * Reference: Wyman, Sloan & Shirley 2013, JCGT 2(2), eqs. 2-4 (multi-lobe 1931 fit).
 */
export function cie1931Cmf(out: Float64Array, lambdaNm: number): Float64Array {
  out[0] = 1.056 * lobe(lambdaNm, 599.8, 0.0264, 0.0323) + 0.362 * lobe(lambdaNm, 442.0, 0.0624, 0.0374) - 0.065 * lobe(lambdaNm, 501.1, 0.049, 0.0382);
  out[1] = 0.821 * lobe(lambdaNm, 568.8, 0.0213, 0.0247) + 0.286 * lobe(lambdaNm, 530.9, 0.0613, 0.0322);
  out[2] = 1.217 * lobe(lambdaNm, 437.0, 0.0845, 0.0278) + 0.681 * lobe(lambdaNm, 459.0, 0.0385, 0.0725);
  return out;
}

/**
 * CIE XYZ of a blackbody (relative; 1 nm trapezoid sum over 360-830 nm of Planck's law x CMFs).
 * @param out [X, Y, Z] written (arbitrary common scale)
 * @param temperatureK temperature in kelvin, finite and > 0
 * Reference: Planck 1901; CIE 15:2004 section 7 (tristimulus integration).
 */
export function blackbodyXyz(out: Float64Array, temperatureK: number): Float64Array {
  requireAbove('temperatureK', temperatureK, 0, 'a temperature > 0 in kelvin');
  const cmf = new Float64Array(3);
  let X = 0;
  let Y = 0;
  let Z = 0;
  for (let nm = WAVELENGTH_MIN_NM; nm <= WAVELENGTH_MAX_NM; nm++) {
    const lambda = nm * 1e-9;
    // Planck spectral radiance up to a constant: lambda^-5 / (exp(c2/(lambda T)) - 1).
    const x = SECOND_RADIATION_CONSTANT_M_K / (lambda * temperatureK);
    const radiance = x > 700 ? 0 : 1 / (Math.pow(nm * 1e-3, 5) * Math.expm1(x));
    const weight = nm === WAVELENGTH_MIN_NM || nm === WAVELENGTH_MAX_NM ? 0.5 : 1;
    cie1931Cmf(cmf, nm);
    X += weight * radiance * cmf[0];
    Y += weight * radiance * cmf[1];
    Z += weight * radiance * cmf[2];
  }
  out[0] = X;
  out[1] = Y;
  out[2] = Z;
  return out;
}

/**
 * CIE XYZ to linear sRGB (D65 white), matrix of IEC 61966-2-1:1999.
 * @param out [R, G, B] linear (written)
 * @param xyz [X, Y, Z]
 */
export function xyzToLinearSrgb(out: Float64Array, xyz: ArrayLike<number>): Float64Array {
  const [X, Y, Z] = [xyz[0], xyz[1], xyz[2]];
  out[0] = 3.2406 * X - 1.5372 * Y - 0.4986 * Z;
  out[1] = -0.9689 * X + 1.8758 * Y + 0.0415 * Z;
  out[2] = 0.0557 * X - 0.204 * Y + 1.057 * Z;
  return out;
}

/**
 * sRGB transfer function (IEC 61966-2-1): linear [0, 1] to encoded [0, 1].
 * @param linear linear component (clamped to [0, 1])
 */
export function encodeSrgb(linear: number): number {
  const c = Math.min(1, Math.max(0, linear));
  return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
}

/**
 * Linear sRGB colour of a blackbody, normalised to luminance Y = 1, negative components clipped to 0.
 * @param out [R, G, B] written
 * @param temperatureK temperature in kelvin, > 0
 */
export function blackbodyLinearSrgb(out: Float64Array, temperatureK: number): Float64Array {
  const xyz = blackbodyXyz(new Float64Array(3), temperatureK);
  const y = xyz[1];
  if (y > 0) {
    xyz[0] /= y;
    xyz[2] /= y;
    xyz[1] = 1;
  }
  xyzToLinearSrgb(out, xyz);
  out[0] = Math.max(out[0], 0);
  out[1] = Math.max(out[1], 0);
  out[2] = Math.max(out[2], 0);
  return out;
}

/**
 * Effective temperature of a star from its B-V colour index.
 * @param bMinusV B-V in magnitudes, finite, > -0.6 (the formula's denominators stay positive)
 * @returns temperature in kelvin
 * Reference: Ballesteros 2012, EPL 97, 34008, eq. 14.
 */
export function temperatureFromBMinusV(bMinusV: number): number {
  requireFinite('bMinusV', bMinusV, 'a B-V colour index in magnitudes');
  if (!(bMinusV > -0.6)) throw new RangeError(`bMinusV must be > -0.6 mag (formula range); got ${bMinusV}`);
  return 4600 * (1 / (0.92 * bMinusV + 1.7) + 1 / (0.92 * bMinusV + 0.62));
}

/** Lookup of blackbody linear sRGB (Y = 1) over log10 T, for renderers. */
export class BlackbodyColourTable {
  static readonly LOG10_T_MIN = 2.5; // 316 K
  static readonly LOG10_T_MAX = 6.5; // 3.2 MK: beyond, the colour is the Rayleigh-Jeans limit
  readonly rgb: Float32Array;
  readonly size: number;

  /** @param size number of samples over log10 T (>= 2; default 1024) */
  constructor(size = 1024) {
    if (!(Number.isInteger(size) && size >= 2)) throw new RangeError(`size must be an integer >= 2; got ${size}`);
    this.size = size;
    this.rgb = new Float32Array(3 * size);
    const c = new Float64Array(3);
    const span = BlackbodyColourTable.LOG10_T_MAX - BlackbodyColourTable.LOG10_T_MIN;
    for (let i = 0; i < size; i++) {
      blackbodyLinearSrgb(c, Math.pow(10, BlackbodyColourTable.LOG10_T_MIN + (span * i) / (size - 1)));
      this.rgb[3 * i] = c[0];
      this.rgb[3 * i + 1] = c[1];
      this.rgb[3 * i + 2] = c[2];
    }
  }

  /**
   * Linear sRGB (Y = 1) at temperature T, linear interpolation in log10 T, clamped to the table range.
   * @param out [R, G, B] written (allocation-free)
   * @param temperatureK kelvin (> 0)
   */
  lookup(out: Float32Array | Float64Array, temperatureK: number): Float32Array | Float64Array {
    const span = BlackbodyColourTable.LOG10_T_MAX - BlackbodyColourTable.LOG10_T_MIN;
    let x = ((Math.log10(temperatureK) - BlackbodyColourTable.LOG10_T_MIN) / span) * (this.size - 1);
    if (!(x > 0)) x = 0;
    if (x > this.size - 1) x = this.size - 1;
    const i = Math.min(Math.floor(x), this.size - 2);
    const s = x - i;
    const a = 3 * i;
    out[0] = this.rgb[a] + s * (this.rgb[a + 3] - this.rgb[a]);
    out[1] = this.rgb[a + 1] + s * (this.rgb[a + 4] - this.rgb[a + 1]);
    out[2] = this.rgb[a + 2] + s * (this.rgb[a + 5] - this.rgb[a + 2]);
    return out;
  }

  /**
   * Colour and bolometric brightness factor of a star of temperature T seen with shift g:
   * a blackbody at g T (colour written to out), brightness multiplied by g^4 (returned).
   * @param out [R, G, B] linear sRGB at Y = 1 (written)
   * @param temperatureK rest-frame temperature in K (> 0)
   * @param g observed over emitted photon energy (> 0)
   * @returns bolometric flux factor g^4 (Liouville, MTW section 22.6)
   */
  shiftedStar(out: Float32Array | Float64Array, temperatureK: number, g: number): number {
    this.lookup(out, g * temperatureK);
    const g2 = g * g;
    return g2 * g2;
  }
}

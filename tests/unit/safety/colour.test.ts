import { describe, expect, it } from 'vitest';
import {
  D65_U,
  D65_V,
  linearRgbToUv,
  redRatio,
  relativeLuminance,
  relativeLuminanceSrgb,
  srgbToLinear,
  SRGB_DECODE_BREAKPOINT,
} from '@/lib/safety/colour';
import { close } from './helpers';

describe('relativeLuminanceSrgb', () => {
  it('should give 1 for sRGB white', () => {
    // WCAG 2.2 definition "relative luminance": normalised to 1 for lightest white
    expect(close(relativeLuminanceSrgb(1, 1, 1), 1, 1e-12)).toBe(true);
  });

  it('should give 0.2126 for pure sRGB red and 0 for black', () => {
    // WCAG 2.2 "relative luminance": L = 0.2126 R + 0.7152 G + 0.0722 B
    expect(close(relativeLuminanceSrgb(1, 0, 0), 0.2126, 1e-12)).toBe(true);
    expect(close(relativeLuminanceSrgb(0, 1, 0), 0.7152, 1e-12)).toBe(true);
    expect(close(relativeLuminanceSrgb(0, 0, 0), 0, 1e-12)).toBe(true);
  });

  it('should agree with the 0.03928 breakpoint printed in WCAG 2.2 for every 8-bit code', () => {
    // WCAG 2.2 prints 0.03928, IEC 61966-2-1 uses 0.04045; no 8-bit code (c / 255) lies between them
    // (10/255 = 0.0392, 11/255 = 0.0431), so both give the same luminance for 8-bit content.
    let worst = 0;
    for (let c = 0; c < 256; c++) {
      const s = c / 255;
      const wcag = s <= 0.03928 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4);
      worst = Math.max(worst, Math.abs(relativeLuminanceSrgb(s, s, s) - relativeLuminance(wcag, wcag, wcag)));
    }
    expect(worst).toBeLessThan(1e-12);
  });
});

describe('srgbToLinear', () => {
  it('should decode mid-grey 0.5 to 0.2140', () => {
    // IEC 61966-2-1: ((0.5 + 0.055) / 1.055)^2.4 = 0.21404 (value from memory, checked by the formula)
    expect(close(srgbToLinear(0.5), 0.21404, 1e-5)).toBe(true);
  });

  it('should be continuous at the IEC breakpoint 0.04045', () => {
    // IEC 61966-2-1: the linear and power segments meet at 0.04045 -> 0.0031308 (common practice)
    const below = srgbToLinear(SRGB_DECODE_BREAKPOINT);
    const above = srgbToLinear(SRGB_DECODE_BREAKPOINT + 1e-9);
    expect(close(below, 0.0031308, 1e-7)).toBe(true);
    expect(close(below, above, 1e-7)).toBe(true);
  });
});

describe('linearRgbToUv', () => {
  it("should put D65 white at u'v' = (0.1978, 0.4683)", () => {
    // CIE 15:2004, D65 in the CIE 1976 UCS diagram (value from memory)
    const uv = linearRgbToUv(new Float64Array(2), 1, 1, 1);
    expect(close(uv[0], 0.1978, 1e-3) && close(uv[1], 0.4683, 1e-3)).toBe(true);
    expect(close(D65_U, 0.1978, 1e-3) && close(D65_V, 0.4683, 1e-3)).toBe(true);
  });

  it("should put the sRGB red primary at u'v' = (0.451, 0.523)", () => {
    // IEC 61966-2-1 red primary x, y = 0.64, 0.33; u' = 4x / (-2x + 12y + 3), v' = 9y / (-2x + 12y + 3) (CIE 15:2004)
    const x = 0.64, y = 0.33, d = -2 * x + 12 * y + 3;
    const uv = linearRgbToUv(new Float64Array(2), 1, 0, 0);
    expect(close(uv[0], (4 * x) / d, 1e-3) && close(uv[1], (9 * y) / d, 1e-3)).toBe(true);
  });

  it('should give the same chromaticity at every intensity of one colour', () => {
    // chromaticity depends only on the ratios X : Y : Z (CIE 15:2004)
    const a = linearRgbToUv(new Float64Array(2), 0.8, 0.3, 0.1);
    const b = linearRgbToUv(new Float64Array(2), 0.08, 0.03, 0.01);
    expect(close(a[0], b[0], 1e-12) && close(a[1], b[1], 1e-12)).toBe(true);
  });
});

describe('redRatio', () => {
  it('should be 1 for pure red and 1/3 for grey, 0 for black', () => {
    // WCAG 2.2 note on red flashes: R/(R+G+B)
    expect(close(redRatio(1, 0, 0), 1, 1e-12)).toBe(true);
    expect(close(redRatio(0.5, 0.5, 0.5), 1 / 3, 1e-12)).toBe(true);
    expect(close(redRatio(0, 0, 0), 0, 1e-12)).toBe(true);
  });
});

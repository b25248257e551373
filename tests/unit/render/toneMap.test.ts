import { describe, expect, it } from 'vitest';
import { exposureScale, srgbEncode, srgbEncode16, srgbEncode8, toneMapInPlace } from '@/lib/render/toneMap';
import { close } from './helpers';

describe('srgbEncode', () => {
  it('should follow the IEC 61966-2-1 transfer function', () => {
    // IEC 61966-2-1: 12.92 L below 0.0031308, 1.055 L^(1/2.4) - 0.055 above
    expect(close(srgbEncode(0.002), 0.02584, 1e-6)).toBe(true);
    expect(close(srgbEncode(0.5), 1.055 * Math.pow(0.5, 1 / 2.4) - 0.055, 1e-12)).toBe(true);
    expect(close(srgbEncode(0.5), 0.7354, 1e-4)).toBe(true); // tabulated value, common practice
    expect(srgbEncode(2)).toBe(1);
  });

  it('should give the same 8-bit codes through the lookup table as by direct rounding, away from rounding ties', () => {
    let mismatches = 0;
    for (let i = 0; i <= 10000; i++) {
      const l = i / 10000;
      const exact = 255 * srgbEncode(l);
      if (Math.abs(exact - Math.round(exact) - 0.5) < 0.02 || Math.abs(exact - Math.round(exact) + 0.5) < 0.02) continue;
      if (srgbEncode8(l) !== Math.round(exact)) mismatches++;
    }
    expect(mismatches).toBe(0);
  });

  it('should give the same 16-bit codes through table interpolation as by direct rounding, away from rounding ties', () => {
    // IEC 61966-2-1 evaluated directly with Math.pow is the reference; 200,001 values, denser near the 0.0031308 knee
    let mismatches = 0;
    let checked = 0;
    for (let i = 0; i <= 200000; i++) {
      const l = (i / 200000) ** 3;
      const exact = 65535 * srgbEncode(l);
      if (Math.abs(exact - Math.floor(exact) - 0.5) < 0.01) continue;
      checked++;
      if (srgbEncode16(l) !== Math.round(exact)) mismatches++;
    }
    expect(checked).toBeGreaterThan(190000);
    expect(mismatches).toBe(0);
    expect(srgbEncode16(-1)).toBe(0);
    expect(srgbEncode16(2)).toBe(65535);
  });
});

describe('toneMapInPlace', () => {
  it('should keep hue under Reinhard and map L to L/(1+L)', () => {
    // Reinhard et al. 2002, SIGGRAPH, eq. 3
    const c = new Float64Array([2, 1, 0.5]);
    const l = 0.2126 * 2 + 0.7152 + 0.0722 * 0.5;
    toneMapInPlace(c, 0, 'reinhard');
    expect(close(c[0] / c[1], 2, 1e-12) && close(0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2], l / (1 + l), 1e-12)).toBe(true);
  });

  it('should state exposure in stops', () => {
    expect(close(exposureScale(1) / exposureScale(0), 2, 1e-12)).toBe(true);
    expect(() => exposureScale(Number.NaN)).toThrow(/ev/);
  });
});

import { describe, expect, it } from 'vitest';
import { BlackbodyColourTable, blackbodyLinearSrgb, blackbodyXyz, temperatureFromBMinusV } from '@/lib/relativity';
import { expectClose, expectRelative } from './support/tolerance';

function chromaticity(T: number): [number, number] {
  const c = blackbodyXyz(new Float64Array(3), T);
  const s = c[0] + c[1] + c[2];
  return [c[0] / s, c[1] / s];
}

function uv1960(x: number, y: number): [number, number] {
  const d = -2 * x + 12 * y + 3;
  return [(4 * x) / d, (6 * y) / d];
}

describe('temperatureFromBMinusV', () => {
  it('should follow Ballesteros\' formula', () => {
    // Ballesteros 2012, EPL 97, 34008: T = 4600 (1/(0.92 BV + 1.7) + 1/(0.92 BV + 0.62)).
    expectRelative(temperatureFromBMinusV(0.65), 4600 * (1 / (0.92 * 0.65 + 1.7) + 1 / (0.92 * 0.65 + 0.62)), 1e-15, 'T(0.65)');
    // Sun-like B-V = 0.65 gives about 5800 K (common practice).
    expect(temperatureFromBMinusV(0.65)).toBeGreaterThan(5600);
    expect(temperatureFromBMinusV(0.65)).toBeLessThan(5900);
    expect(() => temperatureFromBMinusV(Number.NaN)).toThrow(RangeError);
  });
});

describe('blackbodyXyz', () => {
  it('should put a 2856 K blackbody at illuminant A', () => {
    // CIE 15:2004: illuminant A x = 0.44757, y = 0.40745. The Wyman-Sloan-Shirley CMF fit (JCGT 2013)
    // carries about 1e-3 of chromaticity error, hence the tolerance.
    const [x, y] = chromaticity(2856);
    expectClose(x, 0.44757, 2e-3, 'x');
    expectClose(y, 0.40745, 2e-3, 'y');
  });

  it('should lie about 0.003 in uv from D65 at 6504 K', () => {
    // physics.md section 6 (CIE 15:2004): D65 x = 0.3127, y = 0.3290 sits ~0.003 above the Planckian locus.
    const [x, y] = chromaticity(6504);
    const [u, v] = uv1960(x, y);
    const [ud, vd] = uv1960(0.3127, 0.329);
    expect(Math.hypot(u - ud, v - vd)).toBeLessThan(0.0045);
  });
});

describe('BlackbodyColourTable', () => {
  it('should match the direct computation and shift a star to g T with g^4 brightness', () => {
    // physics.md section 6: a blackbody at T seen with shift g is a blackbody at g T; bolometric factor g^4 (MTW 22.6).
    const table = new BlackbodyColourTable();
    const fromTable = new Float64Array(3);
    const direct = new Float64Array(3);
    for (const T of [1500, 3000, 5800, 12000, 40000]) {
      table.lookup(fromTable, T);
      blackbodyLinearSrgb(direct, T);
      for (let i = 0; i < 3; i++) expectClose(fromTable[i], direct[i], 2e-3 * Math.max(1, direct[i]), `channel ${i} at ${T} K`);
    }
    const shifted = new Float64Array(3);
    expectRelative(table.shiftedStar(shifted, 5800, 2), 16, 1e-15, 'g^4');
    table.lookup(direct, 11600);
    for (let i = 0; i < 3; i++) expectClose(shifted[i], direct[i], 1e-6, `shifted channel ${i}`);
    // Hot stars are blue, cool stars red.
    table.lookup(direct, 3000);
    expect(direct[0]).toBeGreaterThan(direct[2]);
    table.lookup(direct, 20000);
    expect(direct[2]).toBeGreaterThan(direct[0]);
  });
});

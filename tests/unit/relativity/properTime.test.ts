import { describe, expect, it } from 'vitest';
import { properTimeToSingularity, SOLAR_MASS_SECONDS } from '@/lib/relativity';
import { expectClose, expectRelative } from './support/tolerance';

describe('properTimeToSingularity', () => {
  it('should give the cycloid time pi sqrt(R^3/8) from rest at R', () => {
    // MTW 1973 eq. 31.10; Hartle 2003 ch. 9.
    // At the turning point tau(r) has a square-root branch, so the rounding of energy = sqrt(1 - 2/R)
    // (~1e-16) moves tau by ~sqrt(1e-16 R) relative: the tolerance says so.
    for (const R of [2.5, 6, 10, 40, 1e4]) {
      const tolerance = 1e-12 + 2 * Math.sqrt(Number.EPSILON * R);
      expectRelative(properTimeToSingularity(R, Math.sqrt(1 - 2 / R)), Math.PI * Math.sqrt(R ** 3 / 8), tolerance, `R=${R}`);
    }
  });

  it('should last pi M = 15.47 microseconds per solar mass from rest at the horizon', () => {
    // physics.md section 3 (MTW ch. 31): from rest at r = 2M the fall lasts pi M.
    const tau = properTimeToSingularity(2, 0);
    expectRelative(tau, Math.PI, 1e-14, 'tau in M');
    expectClose(tau * SOLAR_MASS_SECONDS * 1e6, 15.47, 0.005, 'microseconds per solar mass');
  });

  it('should give (2/3) r^(3/2)/sqrt(2) for a fall from rest at infinity', () => {
    // physics.md section 3 (MTW ch. 25): eps = 1.
    for (const r of [0.01, 1, 2, 50]) expectRelative(properTimeToSingularity(r, 1), ((2 / 3) * r ** 1.5) / Math.SQRT2, 1e-13, `r=${r}`);
  });

  it('should agree with a numerical quadrature of dtau = dr / sqrt(eps^2 - 1 + 2/r) for eps > 1', () => {
    // Independent check: midpoint rule in s with r = s^2 (removes the r -> 0 behaviour).
    const r = 7;
    const eps = 1.4;
    let sum = 0;
    const n = 200000;
    const sMax = Math.sqrt(r);
    for (let i = 0; i < n; i++) {
      const s = ((i + 0.5) / n) * sMax;
      sum += (2 * s) / Math.sqrt(eps * eps - 1 + 2 / (s * s));
    }
    expectRelative(properTimeToSingularity(r, eps), (sum * sMax) / n, 1e-8, 'tau');
  });

  it('should throw RangeError for bad arguments', () => {
    expect(() => properTimeToSingularity(-1, 1)).toThrow(/r must/);
    expect(() => properTimeToSingularity(10, 0.5)).toThrow(/energy/);
    expect(() => properTimeToSingularity(10, Number.NaN)).toThrow(RangeError);
  });
});

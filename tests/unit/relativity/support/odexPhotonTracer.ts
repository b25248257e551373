/**
 * Independent reference for tests and the benchmark: integrates the null
 * geodesic orbit equation d^2u/dphi^2 = -u + 3u^2 (u = M/r; Hartle 2003 eq.
 * 9.62 differentiated) with odex, Hairer & Wanner's Gragg-Bulirsch-Stoer
 * extrapolation solver, at tight tolerance. The independent variable is the
 * azimuth, never Schwarzschild t, so rays cross r = 2M without trouble.
 * Fates follow physics.md section 5 (the E < 0 'far-side' label is definitional).
 */
import { Solver } from 'odex';

export interface OdexRay {
  fate: 'sky' | 'horizon' | 'far-side';
  phi: number;
}

const MAX_AZIMUTH_RAD = 400;

/**
 * Traces one ray back from a radial observer with odex.
 * @param r radius in M
 * @param psi look angle from outward radial (observer frame), radians, 0 < psi < pi
 * @param eps observer -u_t
 * @param ur observer u^r
 * @param tolerance odex absolute and relative tolerance
 */
export function odexTraceRay(r: number, psi: number, eps: number, ur: number, tolerance = 1e-12): OdexRay {
  const energy = eps - Math.cos(psi) * ur; // E / E_loc (physics.md section 5)
  const kr = ur - Math.cos(psi) * eps; // k^r / E_loc
  const angular = r * Math.sin(psi); // L / E_loc
  const u0 = 1 / r;
  const w0 = kr / angular; // du/dphi along the backward path
  const solver = new Solver(2);
  solver.absoluteTolerance = tolerance;
  solver.relativeTolerance = tolerance;
  solver.denseOutput = true;
  solver.maxSteps = 1_000_000;
  const startedInside = u0 > 0.5;
  let crossedOut = !startedInside;
  let result: OdexRay | null = null;
  const refine = (dense: (c: number, x: number) => number, a: number, b: number, level: number): number => {
    let lo = a;
    let hi = b;
    const fa = dense(0, a) - level;
    for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); i++) {
      const mid = 0.5 * (lo + hi);
      const fm = dense(0, mid) - level;
      if (fm === 0) return mid;
      if (Math.sign(fm) === Math.sign(fa)) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  };
  solver.maxStepSize = 0.05;
  let wOld = w0;
  let runaway = false;
  solver.solve(
    (_phi, y) => [y[1], -y[0] + 3 * y[0] * y[0]],
    0,
    [u0, w0],
    MAX_AZIMUTH_RAD,
    (_n, xOld, x, y, dense) => {
      if (dense === undefined || x === xOld) return;
      const uOld = dense(0, xOld);
      const u = y[0];
      const turned = wOld < 0 && y[1] >= 0;
      wOld = y[1];
      if (u > 1e4) {
        runaway = true;
        return false;
      }
      // A turning point just outside r = 2 can fit inside one step: look for the minimum of u.
      if (!crossedOut && turned && uOld > 0.5 && u > 0.5) {
        let a = xOld;
        let b = x;
        for (let i = 0; i < 200; i++) {
          const m1 = a + (b - a) / 3;
          const m2 = b - (b - a) / 3;
          if (dense(0, m1) < dense(0, m2)) b = m2;
          else a = m1;
        }
        const xMin = 0.5 * (a + b);
        if (dense(0, xMin) <= 0.5) {
          if (energy < 0) {
            result = { fate: 'far-side', phi: refine(dense, xOld, xMin, 0.5) };
            return false;
          }
          result = { fate: 'horizon', phi: refine(dense, xMin, x, 0.5) };
          return false;
        }
      }
      // Crossing r = 2 outward is checked first: one step may cross r = 2 and reach infinity.
      if (!crossedOut && uOld > 0.5 && u <= 0.5) {
        if (energy < 0) {
          result = { fate: 'far-side', phi: refine(dense, xOld, x, 0.5) };
          return false;
        }
        crossedOut = true;
      }
      if (u <= 0 && uOld > 0) {
        result = { fate: 'sky', phi: refine(dense, xOld, x, 0) };
        return false;
      }
      if (crossedOut && uOld < 0.5 && u >= 0.5) {
        result = { fate: 'horizon', phi: refine(dense, xOld, x, 0.5) };
        return false;
      }
      return;
    },
  );
  if (result === null || runaway) throw new Error(`odex reference did not finish for r=${r} psi=${psi}`);
  return result;
}

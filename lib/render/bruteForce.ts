/**
 * Brute-force reference renderer: every pixel's null geodesic is integrated
 * on its own with a general-purpose ODE solver instead of being looked up in
 * the per-frame ray table, then shaded by exactly the same code (shade.ts).
 * It exists to check the table-based renderer and to measure what the table
 * saves (tests/bench/render.bench.ts); it is far too slow for production.
 *
 * Geodesic: in the orbital plane, with u = M/r and the azimuth phi swept
 * along the backward path as the independent variable, a null geodesic obeys
 * d^2u/dphi^2 = 3u^2 - u (Hartle 2003 eq. 9.62 differentiated; MTW section 25.6).
 * Using phi rather than Schwarzschild t lets rays cross r = 2M. The start is
 * u = 1/r, du/dphi = k^r / L from the photon constants seen by the camera's
 * reference observer (physics.md section 5). Integrated alongside is the
 * variational equation for d/dpsi of (u, du/dphi), which gives dphi/dpsi of
 * the end point for the pixel footprint. The ray stops where u reaches 0 (the
 * sky at infinity) or 1/2 (the horizon), with the fate rules of physics.md
 * section 5. Solver: odex, Hairer & Wanner's GBS extrapolation code (npm
 * registry, BSD-2-Clause), at relative and absolute tolerance 1e-11 by default,
 * which agrees with the table to about 1e-8 rad away from the shadow edge.
 *
 * odex is a devDependency: import this file from tests and benchmarks only.
 */
import { Solver } from 'odex';
import { FATE_FAR_SIDE, FATE_HORIZON, FATE_SKY, type RayLookup } from '../relativity';
import type { FramePlan } from './frame';
import { RowRenderer, type RowBand } from './renderRows';
import type { RayTracer } from './shade';

/** Default relative and absolute tolerance of the integration (dimensionless, on u = M/r and du/dphi). */
export const BRUTE_FORCE_TOLERANCE = 1e-11;
/** Longest azimuth integrated, radians; rays near the photon sphere wind many times before leaving. */
const MAX_AZIMUTH_RAD = 400;
/** Look angles this close to 0 or pi are radial rays: no orbital plane, phi = 0. */
const RADIAL_SIN = 1e-9;

/**
 * A RayTracer that integrates each ray's geodesic with odex.
 * Allocates per ray (it is the slow reference by design).
 */
export class GeodesicRayTracer implements RayTracer {
  /** rays traced and solver steps taken so far (for reports) */
  rays = 0;
  steps = 0;

  /**
   * @param r camera radius, M (> 0)
   * @param eps reference observer's -u_t
   * @param ur reference observer's u^r (eps^2 - ur^2 = 1 - 2/r)
   * @param tolerance odex relative and absolute tolerance, 1e-14..1e-3
   */
  constructor(
    private readonly r: number,
    private readonly eps: number,
    private readonly ur: number,
    private readonly tolerance = BRUTE_FORCE_TOLERANCE,
  ) {
    if (!(r > 0) || !Number.isFinite(r)) throw new RangeError('r: finite radius > 0 in units of M');
    if (!Number.isFinite(eps) || !Number.isFinite(ur)) throw new RangeError('eps, ur: finite');
    if (Math.abs(eps * eps - ur * ur - (1 - 2 / r)) > 1e-9 * Math.max(1, eps * eps)) {
      throw new RangeError('eps, ur: must satisfy eps^2 - ur^2 = 1 - 2/r');
    }
    if (!(tolerance >= 1e-14 && tolerance <= 1e-3)) throw new RangeError('tolerance: 1e-14..1e-3');
  }

  /**
   * Integrate the ray seen at look angle psi.
   * @param psi look angle from the outward radial axis (reference observer frame), radians, 0..pi
   * @param cosPsi cos(psi)
   * @param out fate, phi (radians swept back to infinity or to r = 2M), dPhiDPsi, g; jacobian left as is
   * @returns out
   */
  trace(psi: number, cosPsi: number, out: RayLookup): RayLookup {
    if (!(psi >= 0 && psi <= Math.PI)) throw new RangeError('psi: 0..pi radians');
    const { r, eps, ur } = this;
    const energy = eps - cosPsi * ur; // E / E_loc (physics.md section 5)
    out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
    const sinPsi = Math.sin(psi);
    this.rays++;
    if (sinPsi < RADIAL_SIN) {
      // radial ray: no azimuth swept; its slope is the limit of nearby rays' phi / (psi offset)
      const offset = 1e-6;
      const near = cosPsi > 0 ? offset : Math.PI - offset;
      this.integrate(near, Math.cos(near), Math.sin(near), out);
      out.dPhiDPsi = cosPsi > 0 ? out.phi / offset : -out.phi / offset;
      const kr = ur - cosPsi * eps;
      out.fate = r > 2 ? (kr < 0 ? FATE_SKY : FATE_HORIZON) : energy >= 0 ? FATE_SKY : FATE_FAR_SIDE;
      out.phi = 0;
      out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
      return out;
    }
    return this.integrate(psi, cosPsi, sinPsi, out);
  }

  private integrate(psi: number, cosPsi: number, sinPsi: number, out: RayLookup): RayLookup {
    const { r, eps, ur } = this;
    const energy = eps - cosPsi * ur;
    const kr = ur - cosPsi * eps; // k^r / E_loc
    const angular = r * sinPsi; // L / E_loc
    const u0 = 1 / r;
    const w0 = kr / angular; // du/dphi along the backward path
    // d w0 / d psi = (eps - ur cos psi) / (r sin^2 psi); u0 does not depend on psi
    const dw0 = energy / (r * sinPsi * sinPsi);
    const solver = new Solver(4);
    solver.absoluteTolerance = this.tolerance;
    solver.relativeTolerance = this.tolerance;
    solver.denseOutput = true;
    solver.maxSteps = 1_000_000;
    const startedInside = u0 > 0.5;
    let crossedOut = !startedInside;
    let found = false;
    let steps = 0;
    const finish = (dense: (c: number, x: number) => number, a: number, b: number, level: number, fate: number): false => {
      const phi = bisect(dense, 0, a, b, level);
      out.fate = fate;
      out.phi = phi;
      // u(phi_end(psi), psi) = level  =>  dphi_end/dpsi = -(du/dpsi) / (du/dphi) at the end point
      out.dPhiDPsi = -dense(2, phi) / dense(1, phi);
      found = true;
      return false;
    };
    solver.solve(
      (_phi, y) => [y[1], 3 * y[0] * y[0] - y[0], y[3], (6 * y[0] - 1) * y[2]],
      0,
      [u0, w0, 0, dw0],
      MAX_AZIMUTH_RAD,
      (_n, xOld, x, y, dense) => {
        steps++;
        if (dense === undefined || x === xOld) return;
        // split the step at a turning point (du/dphi = 0), so each piece is monotone in u and a brief
        // excursion across r = 2M inside one step (near-horizon rays with large b) is not missed
        const wOld = dense(1, xOld);
        const turn = wOld * y[1] < 0 ? bisect(dense, 1, xOld, x, 0) : x;
        for (const [a, b] of turn < x ? [[xOld, turn], [turn, x]] : [[xOld, x]]) {
          const uA = dense(0, a);
          const uB = b === x ? y[0] : dense(0, b);
          if (uB <= 0 && uA > 0) return finish(dense, a, b, 0, FATE_SKY);
          if (!crossedOut && uA > 0.5 && uB <= 0.5) {
            // leaving r < 2M backwards: through the white-hole horizon to the far exterior when E < 0
            if (energy < 0) return finish(dense, a, b, 0.5, FATE_FAR_SIDE);
            crossedOut = true;
          }
          if (crossedOut && uA < 0.5 && uB >= 0.5) return finish(dense, a, b, 0.5, FATE_HORIZON);
        }
        return;
      },
    );
    this.steps += steps;
    if (!found) throw new RangeError(`psi: the ray at psi = ${psi} did not end within ${MAX_AZIMUTH_RAD} rad of azimuth`);
    return out;
  }
}

/** Root of dense(component, x) = level in [a, b] by bisection (dense output of one accepted step). */
function bisect(dense: (c: number, x: number) => number, component: number, a: number, b: number, level: number): number {
  let lo = a;
  let hi = b;
  const below = dense(component, a) < level;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); i++) {
    const mid = 0.5 * (lo + hi);
    const value = dense(component, mid);
    if (value === level) return mid;
    if (value < level === below) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * The brute-force tracer of a frame plan's camera.
 * @param plan frame plan
 * @param tolerance odex tolerance (default BRUTE_FORCE_TOLERANCE)
 * @returns the tracer, or null when the plan has lensing switched off (plain remap: nothing to integrate)
 */
export function createBruteForceTracer(plan: FramePlan, tolerance = BRUTE_FORCE_TOLERANCE): GeodesicRayTracer | null {
  if (!plan.req.effects.lensing) return null;
  return new GeodesicRayTracer(plan.optics.radiusM, plan.optics.eps, plan.optics.ur, tolerance);
}

/**
 * Display-linear RGB of a band, every pixel's geodesic integrated (same output as renderBandLinear).
 * @param plan frame plan
 * @param band rows [y0, y1)
 * @param tracer the integrator (default: createBruteForceTracer(plan); read its rays and steps afterwards)
 * @returns 3 floats per pixel, (y1 - y0) * width * 3 long
 */
export function renderBandBruteForce(plan: FramePlan, band: RowBand, tracer = createBruteForceTracer(plan)): Float32Array {
  const { y0, y1 } = band;
  if (!Number.isInteger(y0) || !Number.isInteger(y1) || y0 < 0 || y1 > plan.req.height || y1 <= y0) {
    throw new RangeError(`band: integer rows with 0 <= y0 < y1 <= ${plan.req.height}`);
  }
  const width = plan.req.width;
  const out = new Float32Array((y1 - y0) * width * 3);
  const renderer = new RowRenderer(plan, tracer);
  for (let y = y0; y < y1; y++) renderer.renderRow(y, out, (y - y0) * width * 3);
  return out;
}

/**
 * Display-linear RGB of chosen pixels, every pixel's geodesic integrated (for timing a sample of a frame).
 * @param plan frame plan
 * @param pixels x0, y0, x1, y1, ... integer pixel coordinates inside the frame
 * @param tracer the integrator (default: createBruteForceTracer(plan); read its rays and steps afterwards)
 * @returns 3 floats per pixel, in the order given
 */
export function renderPixelsBruteForce(plan: FramePlan, pixels: ArrayLike<number>, tracer = createBruteForceTracer(plan)): Float32Array {
  if (pixels.length % 2 !== 0) throw new RangeError('pixels: x, y pairs');
  const { width, height } = plan.req;
  const out = new Float32Array((pixels.length / 2) * 3);
  const renderer = new RowRenderer(plan, tracer);
  for (let i = 0; i < pixels.length; i += 2) {
    const x = pixels[i];
    const y = pixels[i + 1];
    if (!Number.isInteger(x) || !Number.isInteger(y) || x < 0 || x >= width || y < 0 || y >= height) {
      throw new RangeError(`pixels: integer coordinates inside ${width} x ${height}`);
    }
    renderer.renderRow(y, out, (i / 2) * 3, x, x + 1);
  }
  return out;
}

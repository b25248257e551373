/**
 * Proper time of radial inward geodesics, in closed form (physics.md section 3):
 * dtau/dr = -1/sqrt(eps^2 - 1 + 2/r), so the time left to r = 0 from r is
 * T(r) = integral_0^r sqrt(x/(2 + k x)) dx with k = eps^2 - 1.
 */
import { requireAbove, requireFinite } from './validate';

// Below |k r| = SERIES_LIMIT the closed forms cancel; a binomial series is exact to ~1e-18 there.
const SERIES_LIMIT = 1e-3;

/**
 * Proper time from r to the singularity along a radial inward geodesic (no checks).
 * @param r radius in M, >= 0
 * @param k eps^2 - 1 (dimensionless), with 2 + k r >= 0
 * @returns proper time in M
 * Reference: MTW 1973 eq. 31.10 (cycloid) for k < 0; elementary integrals otherwise.
 */
export function fallTimeToSingularity(r: number, k: number): number {
  if (r <= 0) return 0;
  const kr = k * r;
  if (Math.abs(kr) < SERIES_LIMIT) {
    // (r^{3/2}/sqrt 2) sum_n binom(-1/2, n) (k r / 2)^n / (n + 3/2)
    let term = 1;
    let sum = 0;
    for (let n = 0; n < 8; n++) {
      sum += term / (n + 1.5);
      term *= (-(n + 0.5) / (n + 1)) * (kr / 2);
    }
    return (Math.pow(r, 1.5) / Math.SQRT2) * sum;
  }
  if (k < 0) {
    // Cycloid: turning radius R = 2/|k|; T = (R asin(sqrt(r/R)) - sqrt(r (R - r)))/sqrt|k|.
    const a = -k;
    const R = 2 / a;
    const x = Math.min(r, R);
    return (R * Math.asin(Math.sqrt(x / R)) - Math.sqrt(x * (R - x))) / Math.sqrt(a);
  }
  return Math.sqrt(r * (2 + kr)) / k - (2 / Math.pow(k, 1.5)) * Math.asinh(Math.sqrt(kr / 2));
}

/**
 * Radius reached when `tauLeft` of proper time remains before the singularity on a
 * radial inward geodesic with k = eps^2 - 1 (inverse of {@link fallTimeToSingularity}).
 * @param tauLeft proper time left in M, >= 0
 * @param k eps^2 - 1
 * @param rMax radius bracket upper bound in M (the fall's starting radius)
 * @returns radius in M, in [0, rMax]
 */
export function radiusAtTimeLeft(tauLeft: number, k: number, rMax: number): number {
  if (tauLeft <= 0) return 0;
  let lo = 0;
  let hi = rMax;
  // Start from the k = 0 power law, then safeguarded Newton (dT/dr = sqrt(r/(2 + k r))).
  let r = Math.min(rMax, Math.pow(1.5 * Math.SQRT2 * tauLeft, 2 / 3));
  for (let i = 0; i < 100; i++) {
    const residual = fallTimeToSingularity(r, k) - tauLeft;
    if (residual > 0) hi = r;
    else lo = r;
    const slope = Math.sqrt(r / Math.max(2 + k * r, 1e-300));
    let next = r - residual / slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - r) <= 1e-15 * Math.max(r, 1e-300)) return next;
    r = next;
  }
  return r;
}

/**
 * Proper time of a radial inward geodesic from r to r = 0.
 * @param r radius in M, finite and > 0
 * @param energy specific energy eps = -u_t, finite, >= 0 and >= sqrt(1 - 2/r) (1: from rest at infinity)
 * @returns proper time in M; from rest at R (eps = sqrt(1 - 2/R)) it is pi sqrt(R^3/8)
 * @throws RangeError naming the argument and the allowed range
 * Reference: physics.md section 3; MTW 1973 ch. 25 and 31; Hartle 2003 ch. 9.
 */
export function properTimeToSingularity(r: number, energy: number): number {
  requireAbove('r', r, 0, 'a finite radius > 0 in units of M');
  requireFinite('energy', energy, 'energy = -u_t, finite and >= 0');
  if (!(energy >= 0)) throw new RangeError(`energy must be >= 0 (energy = -u_t of an inward fall); got ${energy}`);
  const f = 1 - 2 / r;
  if (energy * energy - f < -1e-12 * Math.max(1, energy * energy)) {
    throw new RangeError(
      `energy must be >= sqrt(1 - 2/r) = ${Math.sqrt(f)} to be at r = ${r} (energy too low to reach r); got ${energy}`,
    );
  }
  return fallTimeToSingularity(r, energy * energy - 1);
}

/**
 * Exact azimuth integrals of light rays: with u = M/r the orbit equation is
 * (du/dphi)^2 = P(u) = 1/b^2 - u^2 + 2u^3 (physics.md section 5), so the
 * azimuth swept between two radii without a turning point is
 * integral du / sqrt(P(u)). The roots of P come in closed form and the
 * integrals reduce to Carlson's R_F (Carlson 1995; Carlson 1987, Math. Comp.
 * 49, 595, eq. 2.1 for the all-real-root case; Byrd & Friedman 1971,
 * formula 239.00 for one real root and a complex pair).
 */
import { carlsonRF } from './carlson';

const SQRT3 = Math.sqrt(3);
const INV_SQRT2 = Math.SQRT1_2;

/**
 * Roots of P(u) = 2(u - u1)(u - u2)(u - u3) for a given b, written into a
 * reusable record. Three real roots u1 < 0 < u2 <= 1/3 <= u3 < 1/2 when b > b_c;
 * otherwise one real root u1 < 0 and a pair m +- i n.
 */
export interface PhotonRoots {
  /** true when b > b_c (three real roots) */
  threeReal: boolean;
  u1: number;
  u2: number;
  u3: number;
  /** real part of the complex pair (one-real-root case) */
  m: number;
  /** imaginary part of the complex pair (one-real-root case), >= 0 */
  n: number;
  /** sqrt((m - u1)^2 + n^2), Byrd & Friedman's A (one-real-root case) */
  bfA: number;
  /** modulus squared k^2 of the Legendre form (one-real-root case) */
  bfK2: number;
  /** complementary modulus 1 - k^2, kept without cancellation (one-real-root case) */
  bfKc2: number;
  /** complete integral K(k) (one-real-root case) */
  bfK: number;
}

/** A zeroed roots record to reuse across calls (no allocation per ray). */
export function createPhotonRoots(): PhotonRoots {
  return { threeReal: false, u1: 0, u2: 0, u3: 0, m: 0, n: 0, bfA: 0, bfK2: 0, bfKc2: 0, bfK: 0 };
}

/**
 * Roots of 1/b^2 - u^2 + 2u^3 in closed form (trigonometric method for three
 * real roots, Cardano otherwise), arranged to keep full precision near b_c.
 * @param invB2 1/b^2 in M^-2, >= 0 (0 means b = infinity)
 * @param excess (b^2 - 27)/b^2 = 1 - 27/b^2, dimensionless, passed separately so
 *   callers that know b - b_c accurately keep that accuracy
 * @param out record to fill
 * @returns out
 */
export function photonRoots(invB2: number, excess: number, out: PhotonRoots): PhotonRoots {
  if (excess > 0) {
    // Trigonometric method: u = 1/6 + (1/3) cos(theta/3 - 2 pi k/3), cos(theta) = 1 - 54/b^2,
    // rewritten with x = (pi - theta)/3 = (2/3) asin(sqrt(excess)).
    const x = (2 / 3) * Math.asin(Math.sqrt(Math.min(excess, 1)));
    const sinHalf = Math.sin(0.5 * x);
    const centre = 1 / 3 - (sinHalf * sinHalf) / 3;
    const split = Math.sin(x) / (2 * SQRT3);
    const u3 = centre + split;
    out.threeReal = true;
    out.u3 = u3;
    if (excess < 0.5) {
      out.u2 = centre - split;
      out.u1 = 1 / 6 - Math.cos(x) / 3;
    } else {
      // Far from b_c, u1 and u2 -> 0 and the trigonometric form cancels; deflate by u3:
      // u^3 - u^2/2 + c = (u - u3)(u^2 + alpha u + beta), alpha = -c/u3^2, beta = -c/u3.
      const c = 0.5 * invB2;
      const alpha = -c / (u3 * u3);
      const beta = -c / u3;
      const u2 = 0.5 * (-alpha + Math.sqrt(alpha * alpha - 4 * beta));
      out.u2 = u2;
      out.u1 = u2 > 0 ? beta / u2 : 0; // b = infinity: u1 = u2 = 0
    }
    return out;
  }
  // Cardano for one real root; 216 W = 1 + delta, a = cbrt(1 + delta) >= 1.
  const minusExcess = -excess;
  const s = invB2;
  const sqrtD = Math.sqrt((minusExcess / 108) * (s / 4));
  const delta = 2 * minusExcess + 216 * sqrtD;
  const a = Math.cbrt(1 + delta);
  const aMinus1 = delta / (a * a + a + 1);
  const u1 = (1 - a - 1 / a) / 6;
  const m = 1 / 6 + (a + 1 / a) / 12;
  const n = (aMinus1 * (a + 1)) / a / (4 * SQRT3);
  const mu = m - u1;
  const A = Math.sqrt(mu * mu + n * n);
  const k2 = (A + mu) / (2 * A);
  // 1 - k^2 = (A - mu)/(2A) = n^2/(2A(A + mu)): tiny near b_c, so never formed by subtraction.
  const kc2 = (n * n) / (2 * A * (A + mu));
  out.threeReal = false;
  out.u1 = u1;
  out.m = m;
  out.n = n;
  out.bfA = A;
  out.bfK2 = k2;
  out.bfKc2 = kc2;
  out.bfK = carlsonRF(0, kc2, 1);
  return out;
}

/**
 * Azimuth integral between y and x (y <= x, both where P >= 0 and on the same
 * side of any turning point), three-real-root case. Carlson 1987 eq. (2.1) with
 * the fourth factor set to 1.
 * @param y lower u (M^-1)
 * @param x upper u (M^-1)
 * @param roots roots with threeReal = true
 * @returns azimuth in radians, >= 0
 */
export function azimuthThreeReal(y: number, x: number, roots: PhotonRoots): number {
  if (!(x > y)) return 0;
  const { u1, u2, u3 } = roots;
  // Factors (t - u1), |u2 - t|, |u3 - t|: the sign choice keeps each >= 0 on [y, x].
  const outer = x <= u2 + 1e-300; // region [u1, u2]
  const X1 = Math.sqrt(Math.max(x - u1, 0));
  const Y1 = Math.sqrt(Math.max(y - u1, 0));
  const X2 = Math.sqrt(Math.max(outer ? u2 - x : x - u2, 0));
  const Y2 = Math.sqrt(Math.max(outer ? u2 - y : y - u2, 0));
  const X3 = Math.sqrt(Math.max(outer ? u3 - x : x - u3, 0));
  const Y3 = Math.sqrt(Math.max(outer ? u3 - y : y - u3, 0));
  const dx = x - y;
  const U12 = (X1 * X2 * Y3 + Y1 * Y2 * X3) / dx;
  const U13 = (X1 * X3 * Y2 + Y1 * Y3 * X2) / dx;
  const U23 = (X1 * Y2 * Y3 + Y1 * X2 * X3) / dx;
  return 2 * INV_SQRT2 * carlsonRF(U12 * U12, U13 * U13, U23 * U23);
}

/** Legendre F(chi, k) for chi in [0, pi) with tan^2(chi/2) = X/A (Byrd & Friedman 239.00). */
function legendreFromRatio(X: number, roots: PhotonRoots): number {
  const A = roots.bfA;
  const sum = A + X;
  const cosChi = (A - X) / sum;
  const sinChi = (2 * Math.sqrt(A * X)) / sum;
  const cos2 = cosChi * cosChi;
  // F(chi, k) = sin chi R_F(cos^2 chi, 1 - k^2 sin^2 chi, 1), with 1 - k^2 sin^2 = cos^2 + (1 - k^2) sin^2.
  const f0 = sinChi * carlsonRF(cos2, cos2 + roots.bfKc2 * sinChi * sinChi, 1);
  return X <= A ? f0 : 2 * roots.bfK - f0;
}

/**
 * Azimuth integral between y and x (u1 <= y <= x), one-real-root case:
 * integral du / sqrt(2 (u - u1)((u - m)^2 + n^2)) = (F(chi_x) - F(chi_y)) / sqrt(2A).
 * @returns azimuth in radians, >= 0
 */
export function azimuthOneReal(y: number, x: number, roots: PhotonRoots): number {
  if (!(x > y)) return 0;
  const fx = legendreFromRatio(x - roots.u1, roots);
  const fy = legendreFromRatio(y - roots.u1, roots);
  return (fx - fy) / Math.sqrt(2 * roots.bfA);
}

/** Azimuth integral between y <= x for whichever root structure `roots` holds. */
export function azimuthBetween(y: number, x: number, roots: PhotonRoots): number {
  return roots.threeReal ? azimuthThreeReal(y, x, roots) : azimuthOneReal(y, x, roots);
}

/**
 * The camera's orthonormal frame at an event, as a tangential boost of a
 * radially moving reference observer. For a 4-velocity with energy eps,
 * angular momentum l and u^r, the reference observer has eps/gamma and
 * u^r/gamma with gamma = sqrt(1 + l^2/r^2); the camera then moves relative to it
 * along the tangential axis at v = (l/r)/gamma. Components are given in
 * Painleve-Gullstrand coordinates (T, r, theta, phi), regular at r = 2
 * (dT = dt + sqrt(2/r)/f dr), with the orbit in the equatorial plane.
 */

/** Reference radial observer and boost of the camera relative to it. */
export interface FrameDecomposition {
  /** reference observer's -u_t */
  referenceEnergy: number;
  /** reference observer's u^r */
  referenceUr: number;
  /** camera speed relative to the reference along the tangential axis (signed, +azimuth) */
  tangentialSpeed: number;
  /** Lorentz factor of that speed */
  gamma: number;
}

/**
 * Splits a 4-velocity into a radial reference observer and a tangential boost.
 * @param r radius in M (> 0)
 * @param energy -u_t
 * @param angularMomentum u_phi in M
 * @param ur u^r
 */
export function decomposeFourVelocity(r: number, energy: number, angularMomentum: number, ur: number): FrameDecomposition {
  const lr = angularMomentum / r;
  const gamma = Math.sqrt(1 + lr * lr);
  return { referenceEnergy: energy / gamma, referenceUr: ur / gamma, tangentialSpeed: lr / gamma, gamma };
}

/** PG time component of a vector with (t, r) parts (a^t = A/f, a^r = B) written through A, B: (A + sqrt(2/r) B)/f, regular form. */
function pgTimeComponentOfObserver(r: number, eps: number, ur: number, norm2: number): number {
  // u^T = (eps + s ur)/f with s = sqrt(2/r); for ur <= 0 rationalise: (norm2 + ur^2)/(eps - s ur),
  // where eps^2 - ur^2 = f norm2 (norm2 = 1 + l^2/r^2, or 1 for the reference observer).
  const s = Math.sqrt(2 / r);
  const f = 1 - 2 / r;
  if (ur <= 0 && eps - s * ur > 0) return (norm2 + ur * ur) / (eps - s * ur);
  return (eps + s * ur) / f;
}

/**
 * Camera tetrad in PG components: rows e0 (= u), e1 (outward radial), e2 (tangential,
 * +azimuth), e3 (orbit normal = e1 x e2 in the hole frame), 16 numbers.
 * @param out 16 entries written
 * @param r radius in M (> 0)
 * @param d decomposition from {@link decomposeFourVelocity}
 * @returns out
 */
export function cameraTetradPG(out: Float64Array, r: number, d: FrameDecomposition): Float64Array {
  const { referenceEnergy: eps, referenceUr: ur, tangentialSpeed: v, gamma } = d;
  const s = Math.sqrt(2 / r);
  const f = 1 - 2 / r;
  const refT = pgTimeComponentOfObserver(r, eps, ur, 1);
  // Reference radial axis e1 = (u^r/f, eps) in (t, r): PG time part (ur + s eps)/f = (eps^2 - 1)/(ur - s eps) for ur <= 0.
  const axisT = ur <= 0 && ur - s * eps < 0 ? (eps * eps - 1) / (ur - s * eps) : (ur + s * eps) / f;
  const invR = 1 / r;
  out.fill(0);
  // e0 = gamma (u_ref + v e_phi)
  out[0] = gamma * refT;
  out[1] = gamma * ur;
  out[3] = gamma * v * invR;
  // e1 = radial axis of the reference
  out[4] = axisT;
  out[5] = eps;
  // e2 = gamma (e_phi + v u_ref)
  out[8] = gamma * v * refT;
  out[9] = gamma * v * ur;
  out[11] = gamma * invR;
  // e3 = -e_theta (right-handed with radial and tangential in the hole frame)
  out[14] = -invR;
  return out;
}

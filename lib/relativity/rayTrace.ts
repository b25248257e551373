/**
 * The backward tracing of one light ray seen by a radially moving (or
 * hovering) observer: fate, azimuth swept and frequency shift, by the exact
 * rules of physics.md section 5. Internal, allocation-free core shared by
 * observeRay and the per-frame ray table.
 */
import { CRITICAL_IMPACT_PARAMETER_M as CRITICAL_B } from './constants';
import { azimuthBetween, createPhotonRoots, photonRoots, type PhotonRoots } from './photonOrbit';

/** Fate codes used in typed arrays: sky, horizon, far side. */
export const FATE_SKY = 0;
export const FATE_HORIZON = 1;
export const FATE_FAR_SIDE = 2;

/** Result record of {@link traceRadialObserverRay}; reuse one per thread. */
export interface RayTrace {
  /** FATE_SKY, FATE_HORIZON or FATE_FAR_SIDE */
  fate: number;
  /** azimuth swept along the backward path, radians, >= 0 */
  phi: number;
  /** E_obs / E_infinity = 1/|E/E_loc|, dimensionless (Infinity on the horizon image) */
  g: number;
  /** photon energy at infinity per unit observed energy, E/E_loc (signed) */
  energyRatio: number;
  /** photon radial velocity k^r per unit observed energy (signed, future-directed) */
  radialRatio: number;
  /** 1/b^2 in M^-2 (Infinity for a purely radial ray) */
  invB2: number;
}

/** A zeroed trace record to reuse. */
export function createRayTrace(): RayTrace {
  return { fate: FATE_SKY, phi: 0, g: 1, energyRatio: 1, radialRatio: 0, invB2: 0 };
}

const sharedRoots: PhotonRoots = createPhotonRoots();

/**
 * Traces one ray backward from a radial observer.
 * @param r areal radius of the observer in M, > 0
 * @param cosPsi cosine of the look angle from the outward radial unit vector e1 (observer frame)
 * @param sinPsi sine of that angle, >= 0
 * @param eps observer's specific energy -u_t (any sign inside the horizon, > 0 outside)
 * @param ur observer's u^r (< 0 inside the horizon); eps^2 - ur^2 = 1 - 2/r
 * @param out record to fill
 * @param excessHint (b^2 - 27)/b^2 computed accurately by the caller ({@link criticalExcess}), or NaN
 * @returns out
 * Reference: physics.md section 5 (photon constants in the observer frame, fate rules).
 */
export function traceRadialObserverRay(
  r: number,
  cosPsi: number,
  sinPsi: number,
  eps: number,
  ur: number,
  out: RayTrace,
  excessHint = NaN,
): RayTrace {
  const uc = 1 / r;
  // physics.md section 5: E = E_loc (eps - cos psi u^r), k^r = E_loc (u^r - eps cos psi), L = r E_loc sin psi.
  const energy = eps - cosPsi * ur;
  const kr = ur - cosPsi * eps;
  const angular = r * sinPsi;
  out.energyRatio = energy;
  out.radialRatio = kr;
  out.g = energy === 0 ? Infinity : 1 / Math.abs(energy);
  const outside = r > 2;
  if (angular === 0) {
    // Purely radial ray: no azimuth is swept.
    out.invB2 = Infinity;
    out.phi = 0;
    out.fate = outside ? (kr < 0 ? FATE_SKY : FATE_HORIZON) : energy >= 0 ? FATE_SKY : FATE_FAR_SIDE;
    return out;
  }
  const ratio = energy / angular;
  const invB2 = ratio * ratio;
  out.invB2 = invB2;
  // excess = 1 - 27/b^2 written as ((r sin)^2 - 27 E^2)/(r sin)^2.
  const excess = Number.isNaN(excessHint) ? (angular * angular - 27 * energy * energy) / (angular * angular) : excessHint;
  const roots = photonRoots(invB2, excess, sharedRoots);
  if (outside) {
    if (kr < 0) {
      // Backward ray moves outward.
      if (r < 3 && roots.threeReal) {
        const start = Math.max(uc, roots.u3);
        out.fate = FATE_HORIZON;
        out.phi = azimuthBetween(roots.u3, start, roots) + azimuthBetween(roots.u3, 0.5, roots);
      } else {
        out.fate = FATE_SKY;
        out.phi = azimuthBetween(0, roots.threeReal ? Math.min(uc, roots.u2) : uc, roots);
      }
    } else if (r > 3 && roots.threeReal) {
      // Backward ray moves inward, turns outside the photon sphere and escapes.
      const start = Math.min(uc, roots.u2);
      out.fate = FATE_SKY;
      out.phi = azimuthBetween(start, roots.u2, roots) + azimuthBetween(0, roots.u2, roots);
    } else {
      out.fate = FATE_HORIZON;
      out.phi = azimuthBetween(roots.threeReal ? Math.max(uc, roots.u3) : uc, 0.5, roots);
    }
    return out;
  }
  if (energy > 0 || (energy === 0 && invB2 === 0)) {
    if (roots.threeReal) {
      // Came in through our horizon after turning between r = 2 and r = 3.
      out.fate = FATE_HORIZON;
      out.phi = azimuthBetween(roots.u3, uc, roots) + azimuthBetween(roots.u3, 0.5, roots);
    } else {
      out.fate = FATE_SKY;
      out.phi = azimuthBetween(0, uc, roots);
    }
    return out;
  }
  // E < 0: light from the far exterior of the eternal hole.
  out.fate = FATE_FAR_SIDE;
  out.phi = azimuthBetween(0.5, uc, roots);
  return out;
}

/** Centre of the two b = b_c crossings in psi: pi/2 - atan2(b_c u^r, r) (see criticalExcess). */
export function criticalCentre(r: number, ur: number): number {
  return Math.PI / 2 - Math.atan2(CRITICAL_B * ur, r);
}

/**
 * (b^2 - 27)/b^2 for the ray at psi = centre + w, without the cancellation of
 * (r sin psi)^2 - 27 E^2 near the shadow edge: r sin psi - b_c E = A sin(psi + delta) - b_c eps
 * = -2A sin^2(w/2) + (A^2 - 27 eps^2)/(A + b_c eps), with A^2 = r^2 + 27 u^r^2 and
 * A^2 - 27 eps^2 = (r - 3)^2 (r + 6)/r exactly (eps^2 - u^r^2 = 1 - 2/r).
 * @param w psi minus {@link criticalCentre}, radians
 * @returns the excess, dimensionless (NaN for a purely radial ray)
 */
export function criticalExcess(r: number, eps: number, ur: number, w: number, cosPsi: number, sinPsi: number): number {
  const amp = Math.hypot(r, CRITICAL_B * ur);
  const sinHalf = Math.sin(0.5 * w);
  const minus = -2 * amp * sinHalf * sinHalf + ((r - 3) * (r - 3) * (r + 6)) / r / (amp + CRITICAL_B * eps);
  const angular = r * sinPsi;
  const plus = angular + CRITICAL_B * (eps - cosPsi * ur);
  return (minus * plus) / (angular * angular);
}

/** Total bending of a light ray that passes the hole. */
import { CRITICAL_IMPACT_PARAMETER_M } from './constants';
import { azimuthThreeReal, createPhotonRoots, photonRoots } from './photonOrbit';

const roots = createPhotonRoots();

/**
 * Total deflection of a ray from infinity back to infinity, alpha = 2 phi(periapsis) - pi.
 * @param b impact parameter L/E in M, finite and > 3 sqrt(3)
 * @returns deflection angle in radians (> 0)
 * @throws RangeError for b <= 3 sqrt(3) (the ray is captured) or non-finite b
 * Reference: physics.md section 5; weak field Epstein & Shapiro 1980; strong field Bozza 2002.
 */
export function deflectionAngle(b: number): number {
  if (typeof b !== 'number' || !Number.isFinite(b)) {
    throw new RangeError(`b must be a finite impact parameter > 3*sqrt(3) M; got ${String(b)}`);
  }
  if (!(b > CRITICAL_IMPACT_PARAMETER_M)) {
    throw new RangeError(
      `b must be > 3*sqrt(3) = ${CRITICAL_IMPACT_PARAMETER_M} M: smaller impact parameters are captured by the hole; got ${b}`,
    );
  }
  const b2 = b * b;
  const excess = ((b - CRITICAL_IMPACT_PARAMETER_M) * (b + CRITICAL_IMPACT_PARAMETER_M)) / b2;
  photonRoots(1 / b2, excess, roots);
  return 2 * azimuthThreeReal(0, roots.u2, roots) - Math.PI;
}

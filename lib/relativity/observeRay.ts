/**
 * Public entry point for one ray: what a static or radially falling observer
 * sees along a look direction.
 */
import { createRayTrace, criticalCentre, criticalExcess, FATE_FAR_SIDE, FATE_HORIZON, traceRadialObserverRay } from './rayTrace';
import { requireAbove, requireFinite, requireInRange } from './validate';

/** The observer of {@link observeRay}: hovering, or falling radially inward on a geodesic. */
export type RadialObserver = { kind: 'static' } | { kind: 'radial'; energy: number };

/** Where the backward ray ends: the sky at infinity, our horizon, or the far exterior. */
export type RayFate = 'sky' | 'horizon' | 'far-side';

/** Result of {@link observeRay}. */
export interface ObservedRay {
  fate: RayFate;
  /** total azimuth swept along the backward path, radians (psi in flat space; > pi when the ray wraps) */
  phi: number;
  /** observed photon energy over its energy at infinity, dimensionless (for 'far-side': over its energy at the far infinity) */
  g: number;
}

/** Radial kinematics of a radial observer: eps = -u_t and u^r. */
export interface RadialKinematics {
  eps: number;
  ur: number;
}

/**
 * Checks a radius and observer and returns (eps, u^r) for the observer.
 * @param r areal radius in M, > 0 (> 2 for 'static')
 * @param observer hovering or radially infalling observer
 * @param argName name used in error messages for the observer
 * @throws RangeError naming the bad argument and the allowed range
 */
export function radialObserverKinematics(r: number, observer: RadialObserver, argName = 'observer'): RadialKinematics {
  requireAbove('r', r, 0, 'a finite radius > 0 in units of M');
  const f = 1 - 2 / r;
  if (observer === null || typeof observer !== 'object') {
    throw new RangeError(`${argName} must be { kind: 'static' } or { kind: 'radial', energy }`);
  }
  if (observer.kind === 'static') {
    if (!(r > 2)) throw new RangeError(`r must be > 2 (outside the horizon) for a static observer; got ${r}`);
    return { eps: Math.sqrt(f), ur: 0 };
  }
  if (observer.kind === 'radial') {
    const eps = observer.energy;
    requireFinite(`${argName}.energy`, eps, 'energy = -u_t, finite and >= 0');
    if (!(eps >= 0)) throw new RangeError(`${argName}.energy must be >= 0 (energy = -u_t of an inward fall); got ${eps}`);
    const radial2 = eps * eps - f;
    // A tiny negative value is rounding at the turning point (dropped from rest at r).
    if (radial2 < -1e-12 * Math.max(1, eps * eps)) {
      throw new RangeError(
        `${argName}.energy must be >= sqrt(1 - 2/r) = ${Math.sqrt(f)} to be at r = ${r} (energy too low to reach r); got ${eps}`,
      );
    }
    return { eps, ur: -Math.sqrt(Math.max(radial2, 0)) };
  }
  throw new RangeError(`${argName}.kind must be 'static' or 'radial'`);
}

const trace = createRayTrace();

/**
 * The light seen by an observer at radius r looking at angle psi from the
 * outward radial direction, in the observer's own rest frame.
 * @param r areal radius in M (geometric units, M = 1), > 0; > 2 for a static observer
 * @param psi look angle from the outward radial unit vector e1 in the observer frame, radians, [0, pi]
 * @param observer { kind: 'static' } hovers; { kind: 'radial', energy } falls inward with
 *   energy = -u_t >= sqrt(max(0, 1 - 2/r)) (1: from rest at infinity)
 * @returns fate, phi (radians swept back to infinity or to r = 2) and g = E_observed / E_infinity
 * @throws RangeError for NaN, non-positive r, psi outside [0, pi], static at r <= 2, energy too low
 * Reference: physics.md section 5; Carlson 1995 for the exact integrals.
 */
export function observeRay(r: number, psi: number, observer: RadialObserver): ObservedRay {
  const { eps, ur } = radialObserverKinematics(r, observer);
  requireInRange('psi', psi, 0, Math.PI, 'an angle in [0, pi] radians from the outward radial direction');
  const cosPsi = Math.cos(psi);
  const sinPsi = psi === Math.PI ? 0 : Math.sin(psi);
  // Accurate (b^2 - 27)/b^2 where E > 0 (the shadow edge lives there).
  const positive = eps - cosPsi * ur > 0 && sinPsi > 0;
  const excess = positive ? criticalExcess(r, eps, ur, psi - criticalCentre(r, ur), cosPsi, sinPsi) : NaN;
  traceRadialObserverRay(r, cosPsi, sinPsi, eps, ur, trace, excess);
  const fate: RayFate = trace.fate === FATE_HORIZON ? 'horizon' : trace.fate === FATE_FAR_SIDE ? 'far-side' : 'sky';
  return { fate, phi: trace.phi, g: trace.g };
}

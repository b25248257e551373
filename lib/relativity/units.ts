/**
 * Conversion between geometric units (G = c = 1, M = 1) and SI for a hole of
 * a given mass in solar masses (physics.md section 1).
 */
import { SOLAR_MASS_METRES, SOLAR_MASS_SECONDS, STANDARD_GRAVITY_M_PER_S2 } from './constants';
import { requireAbove, requireFinite } from './validate';

/** SI scale of one geometric unit for a given mass. */
export interface MassScale {
  /** GM/c^3 in seconds: one geometric time unit */
  secondsPerM: number;
  /** GM/c^2 in metres: one geometric length unit */
  metresPerM: number;
}

/**
 * SI scale of the geometric unit M for a hole of `massSolar` solar masses.
 * @param massSolar mass in solar masses, finite and > 0
 * @returns seconds and metres per M
 * Reference: IAU 2015 Resolution B3 (GM_sun = 1.3271244e20 m^3/s^2).
 */
export function massScale(massSolar: number): MassScale {
  requireAbove('massSolar', massSolar, 0, 'a mass in solar masses, finite and > 0');
  return { secondsPerM: massSolar * SOLAR_MASS_SECONDS, metresPerM: massSolar * SOLAR_MASS_METRES };
}

/**
 * Proper time in geometric units to seconds.
 * @param tauM proper time in M (finite)
 * @param massSolar mass in solar masses (> 0)
 * @returns seconds
 */
export function geometricTimeToSeconds(tauM: number, massSolar: number): number {
  requireFinite('tauM', tauM, 'a proper time in units of M');
  return tauM * massScale(massSolar).secondsPerM;
}

/**
 * A proper acceleration in geometric units (1/M) to multiples of standard gravity g0.
 * @param accelerationPerM acceleration in units of c^2/(GM/c^2) (finite)
 * @param massSolar mass in solar masses (> 0)
 * @returns acceleration in g0 = 9.80665 m/s^2
 */
export function geometricAccelerationToG(accelerationPerM: number, massSolar: number): number {
  requireFinite('accelerationPerM', accelerationPerM, 'an acceleration in units of 1/M');
  const { secondsPerM } = massScale(massSolar);
  // a_SI = a_geo * c / (GM/c^3)
  return (accelerationPerM * 299_792_458) / secondsPerM / STANDARD_GRAVITY_M_PER_S2;
}

/**
 * A tidal tensor component (geometric, 1/M^2, i.e. acceleration per unit length) to SI.
 * @param tidalPerM2 component in M^-2 (finite)
 * @param massSolar mass in solar masses (> 0)
 * @returns acceleration difference per metre of separation, in s^-2
 */
export function geometricTidalToPerSecondSquared(tidalPerM2: number, massSolar: number): number {
  requireFinite('tidalPerM2', tidalPerM2, 'a tidal component in units of 1/M^2');
  const { secondsPerM } = massScale(massSolar);
  return tidalPerM2 / (secondsPerM * secondsPerM);
}

/** Radius in M to Schwarzschild radii (r_s = 2M), as the interface shows it. */
export function radiusToSchwarzschildRadii(rM: number): number {
  requireFinite('rM', rM, 'a radius in units of M');
  return rM / 2;
}

/** Radius in Schwarzschild radii (r_s = 2M) to M, for producers who type r_s. */
export function schwarzschildRadiiToRadius(rRs: number): number {
  requireFinite('rRs', rRs, 'a radius in Schwarzschild radii');
  return rRs * 2;
}

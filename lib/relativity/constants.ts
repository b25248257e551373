/**
 * Physical constants and characteristic radii. Geometric units (G = c = 1)
 * with the hole's mass M = 1 unless a name carries an SI unit.
 */

/** GM_sun / c^3 in seconds: IAU 2015 Resolution B3 nominal GM_sun = 1.3271244e20 m^3 s^-2, c exact. */
export const SOLAR_MASS_SECONDS = 4.925490947e-6;

/** GM_sun / c^2 in metres (IAU 2015 Resolution B3; c = 299 792 458 m/s exact). */
export const SOLAR_MASS_METRES = 1476.625;

/** Standard gravity in m/s^2 (CGPM 1901, exact), used to express thrust and tides in g. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** Event horizon radius in M (Schwarzschild 1916). */
export const HORIZON_RADIUS_M = 2;

/** Photon-sphere radius in M (Hartle 2003, ch. 9). */
export const PHOTON_SPHERE_RADIUS_M = 3;

/** Marginally bound circular orbit radius in M (Bardeen, Press & Teukolsky 1972). */
export const MARGINALLY_BOUND_RADIUS_M = 4;

/** Innermost stable circular orbit radius in M (Bardeen, Press & Teukolsky 1972). */
export const ISCO_RADIUS_M = 6;

/** Critical impact parameter b_c = 3 sqrt(3) M of light (Hartle 2003, ch. 9). */
export const CRITICAL_IMPACT_PARAMETER_M = 3 * Math.sqrt(3);

/** b_c^2 = 27 M^2, kept exact for the root formulas. */
export const CRITICAL_IMPACT_PARAMETER_SQUARED = 27;

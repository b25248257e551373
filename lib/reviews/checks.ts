/**
 * The published check values the engine must reproduce, as data plus the
 * engine calls that compute them. The accuracy report runs these live (so an
 * advisor sees today's engine pass them) and tests/unit/reviews runs the very
 * same definitions. Pure TypeScript: no framework, DOM or database imports.
 */
import {
  buildRayTableForRadialObserver,
  deflectionAngle,
  observeRay,
  properTimeToSingularity,
  SOLAR_MASS_METRES,
  SOLAR_MASS_SECONDS,
} from '@/lib/relativity';

/** Arcseconds per radian (exact by definition of the arcsecond). */
const ARCSEC_PER_RAD = (180 / Math.PI) * 3600;
const DEG_PER_RAD = 180 / Math.PI;
/** Critical impact parameter b_c = 3 sqrt(3) M (Hartle 2003 ch. 9). */
const B_CRIT_M = 3 * Math.sqrt(3);
/** Nominal solar radius, m (IAU 2015 Resolution B3). */
const SOLAR_RADIUS_METRES = 6.957e8;

/** One published value and the engine computation that must reproduce it. */
export interface PublishedCheck {
  /** stable identifier (kebab-case) */
  id: string;
  /** short title for advisors */
  title: string;
  /** one sentence for a general audience: what this checks and why it matters */
  plainWords: string;
  /** the published source (author, year, journal or book, equation) */
  source: string;
  /** unit of `published` and `compute()` (e.g. 'deg', 'arcsec', 'M') */
  unit: string;
  /** the published (or closed-form) value, in `unit` */
  published: number;
  /** largest |computed - published| accepted, in `unit`; the reason is in `toleranceWhy` */
  tolerance: number;
  toleranceWhy: string;
  /** runs the engine; returns the engine's value in `unit` */
  compute: () => number;
}

/** The outcome of one check: the check's description, what the engine gave, and whether it is within tolerance. */
export type CheckResult = Omit<PublishedCheck, 'compute'> & {
  computed: number;
  /** |computed - published|, in `unit` */
  error: number;
  passed: boolean;
};

/**
 * Synge's shadow half-angle for a hovering observer, measured from the
 * direction to the hole.
 * @param rM observer radius in M, finite and > 2
 * @returns half-angle in radians, (0, pi); above pi/2 inside the photon sphere
 * Reference: Synge 1966, MNRAS 131, 463: sin(alpha) = 3 sqrt(3) sqrt(1 - 2/r)/r.
 */
export function syngeShadowHalfAngle(rM: number): number {
  if (!Number.isFinite(rM) || !(rM > 2)) throw new RangeError(`rM must be a finite radius > 2 (outside the horizon, in M); got ${rM}`);
  // At r = 3 the sine is 1 up to rounding: clamp so asin stays defined.
  const s = Math.min(1, (B_CRIT_M * Math.sqrt(1 - 2 / rM)) / rM);
  return rM < 3 ? Math.PI - Math.asin(s) : Math.asin(s);
}

/** Bozza's constant b-bar = log(216 (7 - 4 sqrt 3)) - pi (Bozza 2002, table I: -0.4002). */
export const BOZZA_CONSTANT = Math.log(216 * (7 - 4 * Math.sqrt(3))) - Math.PI;

/**
 * Bozza's strong-deflection limit for the Schwarzschild hole.
 * @param excess b/b_c - 1, finite and > 0 (small: the limit holds as it tends to 0)
 * @returns deflection angle in radians
 * Reference: Bozza 2002, Phys. Rev. D 66, 103001: alpha = -log(b/b_c - 1) + log(216 (7 - 4 sqrt 3)) - pi.
 */
export function bozzaStrongDeflection(excess: number): number {
  if (!Number.isFinite(excess) || !(excess > 0)) throw new RangeError(`excess must be b/b_c - 1, finite and > 0; got ${excess}`);
  // Coefficient a = 1 for Schwarzschild (Bozza 2002, table I).
  return -Math.log(excess) + BOZZA_CONSTANT;
}

/** Shadow half-angle seen from the engine's ray table (the same table the renderer uses), degrees. */
function tableShadowHalfAngleDeg(rM: number): number {
  return (Math.PI - buildRayTableForRadialObserver(rM, null).shadowEdgePsi) * DEG_PER_RAD;
}

const syngeCheck = (rM: number, where: string): PublishedCheck => ({
  id: `synge-shadow-r${String(rM).replace('.', '_')}`,
  title: `Shadow size seen hovering at ${rM / 2} r_s (${where})`,
  plainWords: `How large the black disc looks to someone hovering at ${rM / 2} Schwarzschild radii: the renderer's own lookup table must put its edge where Synge's formula does.`,
  source: 'Synge 1966, MNRAS 131, 463 (sin alpha = 3 sqrt(3) M sqrt(1 - 2M/r)/r)',
  unit: 'deg',
  published: syngeShadowHalfAngle(rM) * DEG_PER_RAD,
  tolerance: 1e-8,
  toleranceWhy: 'the table computes the edge in closed form; 1e-8 degrees allows for rounding only',
  compute: () => tableShadowHalfAngleDeg(rM),
});

/**
 * Every published check, in the order the report shows them.
 * Sources: physics.md sections 3 and 5.
 */
export const PUBLISHED_CHECKS: readonly PublishedCheck[] = [
  syngeCheck(2.5, 'inside the photon sphere'),
  syngeCheck(6, 'at the ISCO'),
  syngeCheck(20, 'far out'),
  {
    id: 'solar-limb-deflection',
    title: 'Starlight grazing the Sun',
    plainWords: 'The bending of starlight at the edge of the Sun, the effect measured at the 1919 eclipse: the engine must give 1.7512 arcseconds.',
    source: 'Epstein & Shapiro 1980, Phys. Rev. D 22, 2947 (second-order series); GM/c^2 = 1476.6 m, R = 6.957e8 m (IAU 2015 B3)',
    unit: 'arcsec',
    published: 1.7512,
    tolerance: 5e-5,
    toleranceWhy: 'the published value is quoted to 4 decimals',
    compute: () => deflectionAngle(SOLAR_RADIUS_METRES / SOLAR_MASS_METRES) * ARCSEC_PER_RAD,
  },
  {
    id: 'weak-field-series',
    title: 'Weak bending far from the hole (b = 1000 M)',
    plainWords: 'Far from the hole light bends only slightly; the exact engine must agree with the textbook series there.',
    source: 'Epstein & Shapiro 1980, Phys. Rev. D 22, 2947; Keeton & Petters 2005, Phys. Rev. D 72, 104006: alpha = 4M/b + 15 pi M^2/(4 b^2)',
    unit: 'rad',
    published: 4 / 1000 + (15 * Math.PI) / (4 * 1000 * 1000),
    tolerance: 50 / 1000 ** 3,
    toleranceWhy: 'the series stops at b^-2; its b^-3 remainder is bounded by 50/b^3',
    compute: () => deflectionAngle(1000),
  },
  {
    id: 'bozza-strong-deflection',
    title: 'Light skimming the photon sphere (b = b_c (1 + 1e-6))',
    plainWords: 'Light passing just outside the photon sphere winds round the hole before escaping; the engine must follow Bozza\'s logarithmic law there, which shapes the thin bright rings next to the shadow.',
    source: 'Bozza 2002, Phys. Rev. D 66, 103001: alpha = -log(b/b_c - 1) + log(216 (7 - 4 sqrt 3)) - pi',
    unit: 'rad',
    published: bozzaStrongDeflection(1e-6),
    tolerance: 6e-6 + 3e-8,
    toleranceWhy: 'the law drops terms of order (b - b_c), about 6 x 1e-6 here, plus rounding of b - b_c',
    compute: () => deflectionAngle(B_CRIT_M * (1 + 1e-6)),
  },
  {
    id: 'bozza-constant',
    title: 'Bozza\'s constant',
    plainWords: 'The constant in the strong-bending law, as printed in Bozza\'s table.',
    source: 'Bozza 2002, Phys. Rev. D 66, 103001, table I (b-bar = -0.4002)',
    unit: '',
    published: -0.4002,
    tolerance: 5e-5,
    toleranceWhy: 'the table prints 4 decimals',
    compute: () => BOZZA_CONSTANT,
  },
  {
    id: 'cycloid-fall-time',
    title: 'Fall time from rest at 5 r_s',
    plainWords: 'Dropped from rest at 10 M, a traveller\'s own clock must show pi sqrt(R^3/8M) when reaching the singularity: the textbook cycloid.',
    source: 'Misner, Thorne & Wheeler 1973, eq. 31.10; Hartle 2003 ch. 9',
    unit: 'M',
    published: Math.PI * Math.sqrt(10 ** 3 / 8),
    tolerance: Math.PI * Math.sqrt(10 ** 3 / 8) * (1e-12 + 2 * Math.sqrt(Number.EPSILON * 10)),
    toleranceWhy: 'the square-root branch at the turning point turns rounding of the energy (1e-16) into about sqrt(1e-16 R) relative',
    compute: () => properTimeToSingularity(10, Math.sqrt(1 - 2 / 10)),
  },
  {
    id: 'horizon-fall-time',
    title: 'Fall time from rest at the horizon',
    plainWords: 'From rest at the horizon to the singularity takes pi M of the traveller\'s time: 15.47 microseconds for each solar mass of the hole.',
    source: 'Misner, Thorne & Wheeler 1973, ch. 31 (tau = pi M); GM/c^3 = 4.925490947 microseconds (IAU 2015 B3)',
    unit: 'µs per solar mass',
    published: 15.47,
    tolerance: 0.005,
    toleranceWhy: 'the published value is quoted to 2 decimals',
    compute: () => properTimeToSingularity(2, 0) * SOLAR_MASS_SECONDS * 1e6,
  },
  {
    id: 'rain-fall-time',
    title: 'Fall time from the horizon, falling in from rest at infinity',
    plainWords: 'A traveller who fell in from far away crosses the horizon and reaches the singularity (2/3) r^(3/2)/sqrt(2M) later on their own clock: 4/3 M.',
    source: 'Misner, Thorne & Wheeler 1973, ch. 25 (eps = 1 radial fall)',
    unit: 'M',
    published: ((2 / 3) * 2 ** 1.5) / Math.SQRT2,
    tolerance: 1e-12,
    toleranceWhy: 'closed form; rounding only',
    compute: () => properTimeToSingularity(2, 1),
  },
  {
    id: 'hover-blueshift',
    title: 'Blueshift seen hovering at 5 r_s',
    plainWords: 'Starlight falling onto someone hovering near the hole arrives bluer and brighter, by 1/sqrt(1 - 2M/r): the engine\'s colours start from this number.',
    source: 'Hartle 2003, Gravity, ch. 9 (gravitational blueshift g = 1/sqrt(1 - 2M/r))',
    unit: '',
    published: 1 / Math.sqrt(1 - 2 / 10),
    tolerance: 1e-13,
    toleranceWhy: 'closed form; rounding only',
    compute: () => observeRay(10, Math.PI / 2, { kind: 'static' }).g,
  },
];

/**
 * Runs one check against the engine.
 * @param check a published check
 * @returns the result; `passed` is false (never an exception) when the engine throws or returns a non-finite value
 */
export function evaluateCheck(check: PublishedCheck): CheckResult {
  let computed: number;
  try {
    computed = check.compute();
  } catch {
    computed = Number.NaN;
  }
  const error = Math.abs(computed - check.published);
  const passed = Number.isFinite(computed) && error <= check.tolerance;
  const { compute: _compute, ...data } = check;
  return { ...data, computed, error: Number.isFinite(error) ? error : Number.POSITIVE_INFINITY, passed };
}

/**
 * Runs every published check (the report's "engine checks" section).
 * @param checks the checks to run (default: all)
 * @returns one result per check, in order
 */
export function runPublishedChecks(checks: readonly PublishedCheck[] = PUBLISHED_CHECKS): CheckResult[] {
  return checks.map(evaluateCheck);
}

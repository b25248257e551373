/**
 * Camera worldlines built from segments (product.md flow 2). All radii in M,
 * proper times in M (geometric units); convert with units.ts.
 */

/** Hover at fixed r with rockets (r > 2). */
export interface HoverSegment { kind: 'hover'; r?: number; duration: number }
/** Circular geodesic orbit at r > 3; sense +1 moves toward the chain's motion direction. */
export interface CircularOrbitSegment { kind: 'circular-orbit'; r?: number; duration: number; sense?: 1 | -1 }
/**
 * Radial free fall from rest at the start radius (r > 2). Its length is a proper time (duration), the first
 * time it reaches a radius (untilR, M), or neither: to the singularity. The same holds for every fall.
 */
export interface DropSegment { kind: 'drop'; r?: number; duration?: number; untilR?: number }
/** Radial inward free fall starting at r (> 2) with speed measured by a hovering observer there, 0 <= speed < 1. */
export interface FallSegment { kind: 'fall'; r?: number; speed: number; duration?: number; untilR?: number }
/** Free fall with angular momentum: energy = -u_t, angularMomentum = u_phi (M), initial radial sense. */
export interface FreeFallSegment {
  kind: 'free-fall';
  r?: number;
  energy: number;
  angularMomentum: number;
  radialSense: 'in' | 'out';
  duration?: number;
  /** end where r first reaches this radius (M); only for a free fall that reaches the singularity */
  untilR?: number;
}
/** Rockets hold r fixed where the previous segment ended (r > 2), optionally moving tangentially at `orbitalSpeed` (|v| < 1, measured by a hovering observer). */
export interface HoldSegment { kind: 'hold'; duration: number; orbitalSpeed?: number }

export type WorldlineSegment =
  | HoverSegment
  | CircularOrbitSegment
  | DropSegment
  | FallSegment
  | FreeFallSegment
  | HoldSegment;

/** A whole camera path: a chain of segments in one orbital plane. */
export interface WorldlineSpec {
  /** hole mass in solar masses (> 0), for SI readouts */
  massSolar: number;
  /** unit 3-vector, hole's fixed frame: the camera's initial direction from the hole (default +x) */
  startDirection?: readonly [number, number, number];
  /** unit 3-vector orthogonal to startDirection: the positive azimuth (tangential) direction (default +y) */
  motionDirection?: readonly [number, number, number];
  segments: WorldlineSegment[];
}

/** Why a chain is impossible, as data the interface can show beside the field. */
export interface WorldlineIssue {
  /** field path, e.g. "segments[2].r" */
  path: string;
  message: string;
}

/** Orbit bands of physics.md section 2 (names from product.md). */
export type OrbitBand = 'stable orbits' | 'unstable orbits' | 'no orbits' | 'interior';

/** Kinematic state at an event on the path (equatorial plane of the chain). */
export interface PathState {
  /** areal radius, M */
  r: number;
  /** azimuth in the orbital plane from startDirection toward motionDirection, radians */
  azimuth: number;
  /** -u_t */
  energy: number;
  /** u_phi, M (signed along motionDirection) */
  angularMomentum: number;
  /** u^r (dr/dtau) */
  ur: number;
}

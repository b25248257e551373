/**
 * Sampling a worldline at a proper time: position, 4-velocity, camera frame,
 * countdown, orbit band, thrust and tides (physics.md sections 2-4).
 */
import { STANDARD_GRAVITY_M_PER_S2 } from '../constants';
import { symmetricEigenvalues3, tidalTensor } from '../tides';
import { geometricAccelerationToG, geometricTidalToPerSecondSquared, massScale } from '../units';
import { requireAtLeast, requireInRange } from '../validate';
import type { Worldline } from './build';
import { locateSegment, segmentStateAt } from './build';
import { cameraTetradPG, decomposeFourVelocity, type FrameDecomposition } from './cameraFrame';
import { orbitBand } from './orbitBand';
import type { OrbitBand, PathState } from './types';

/** Everything a readout or renderer needs at one proper time. */
export interface WorldlineSample {
  /** chain proper time, M */
  tau: number;
  segmentIndex: number;
  kind: string;
  state: PathState;
  /** unit 3-vector from the hole to the camera, hole's fixed frame */
  position: Float64Array;
  /** 4-velocity in PG coordinates (T, r, theta, phi) */
  fourVelocityPG: Float64Array;
  /** camera tetrad rows e0..e3 in PG components (see cameraFrame.ts) */
  tetradPG: Float64Array;
  /** reference radial observer and the tangential boost to the camera */
  frame: FrameDecomposition;
  /** camera spatial axes in the hole's fixed frame: outward radial, tangential (+azimuth), normal */
  radialAxis: Float64Array;
  tangentAxis: Float64Array;
  normalAxis: Float64Array;
  /** proper time left to the singularity in M, or null where the path does not reach it */
  properTimeLeft: number | null;
  properTimeLeftSeconds: number | null;
  orbitBand: OrbitBand;
  /** proper acceleration needed, outward positive, in 1/M and in g0 (0 for free fall) */
  thrust: number;
  thrustG: number;
  /** tidal stretch / squeeze per unit length (M^-2) and across the body (in g0) */
  stretchPerM2: number;
  squeezePerM2: number;
  stretchG: number;
  squeezeG: number;
}

/**
 * Samples the worldline at chain proper time tau.
 * @param worldline from buildWorldline
 * @param tau proper time from the chain start in M, 0 <= tau <= worldline.duration
 * @param bodyLengthMetres length of the body the tides act across, m (>= 0; default 2)
 * @returns the sample (allocates; call once per frame, not per pixel)
 * @throws RangeError for tau outside the chain or a bad length
 * Reference: physics.md sections 2-4; MTW 1973 eq. 31.4; Hartle 2003 ch. 9.
 */
export function sampleWorldline(worldline: Worldline, tau: number, bodyLengthMetres = 2): WorldlineSample {
  requireInRange('tau', tau, 0, worldline.duration, `a proper time in [0, ${worldline.duration}] M`);
  requireAtLeast('bodyLengthMetres', bodyLengthMetres, 0, 'a length >= 0 in metres');
  const { seg, index, local } = locateSegment(worldline, tau);
  const state = segmentStateAt(seg, local, { r: 0, azimuth: 0, energy: 0, angularMomentum: 0, ur: 0 });
  // At the singularity itself nothing is defined: sample just before it.
  if (!(state.r > 0)) {
    throw new RangeError(`tau = ${tau} M is the singularity (r = 0); sample tau < ${worldline.duration} M`);
  }
  const { r } = state;
  const p0 = worldline.startDirection;
  const t0 = worldline.motionDirection;
  const c = Math.cos(state.azimuth);
  const s = Math.sin(state.azimuth);
  const position = new Float64Array(3);
  const tangentAxis = new Float64Array(3);
  const normalAxis = new Float64Array(3);
  for (let i = 0; i < 3; i++) {
    position[i] = c * p0[i] + s * t0[i];
    tangentAxis[i] = -s * p0[i] + c * t0[i];
  }
  normalAxis[0] = p0[1] * t0[2] - p0[2] * t0[1];
  normalAxis[1] = p0[2] * t0[0] - p0[0] * t0[2];
  normalAxis[2] = p0[0] * t0[1] - p0[1] * t0[0];
  const frame = decomposeFourVelocity(r, state.energy, state.angularMomentum, state.ur);
  const tetradPG = cameraTetradPG(new Float64Array(16), r, frame);
  // Thrust: hover/hold a = gamma^2 (1 - (r - 2) v^2)/(r^2 sqrt f) (Hartle 2003 ch. 9 for v = 0).
  let thrust = 0;
  if (seg.kind === 'hover' || seg.kind === 'hold') {
    const v = seg.orbitalSpeed;
    thrust = (1 - (r - 2) * v * v) / ((1 - v * v) * r * r * Math.sqrt(1 - 2 / r));
  }
  // Tides: camera frame as orthonormal components in the reference radial frame (t, r, theta, phi).
  const { gamma, tangentialSpeed: v } = frame;
  const local4 = new Float64Array([gamma, 0, 0, gamma * v, 0, 1, 0, 0, gamma * v, 0, 0, gamma, 0, 0, -1, 0]);
  const eig = symmetricEigenvalues3(new Float64Array(3), tidalTensor(new Float64Array(9), r, local4));
  const stretchPerM2 = Math.max(eig[0], 0);
  const squeezePerM2 = Math.max(-eig[2], 0);
  const mass = worldline.massSolar;
  const toG = (k: number) => (geometricTidalToPerSecondSquared(k, mass) * bodyLengthMetres) / STANDARD_GRAVITY_M_PER_S2;
  let properTimeLeft: number | null = null;
  if (worldline.endsAtSingularity) properTimeLeft = worldline.duration - tau;
  else if (Number.isFinite(seg.timeToSingularity)) properTimeLeft = seg.timeToSingularity - local;
  return {
    tau,
    segmentIndex: index,
    kind: seg.kind,
    state,
    position,
    fourVelocityPG: tetradPG.slice(0, 4),
    tetradPG,
    frame,
    radialAxis: position.slice(),
    tangentAxis,
    normalAxis,
    properTimeLeft,
    properTimeLeftSeconds: properTimeLeft === null ? null : properTimeLeft * massScale(mass).secondsPerM,
    orbitBand: orbitBand(r),
    thrust,
    thrustG: geometricAccelerationToG(thrust, mass),
    stretchPerM2,
    squeezePerM2,
    stretchG: toG(stretchPerM2),
    squeezeG: toG(squeezePerM2),
  };
}

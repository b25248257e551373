/**
 * Skywell's exact Schwarzschild physics engine (geometric units, G = c = M = 1).
 * Plain TypeScript: runs on the server, in browser workers and in tests.
 */
export * from './constants';
export { observeRay, radialObserverKinematics } from './observeRay';
export type { ObservedRay, RadialObserver, RayFate, RadialKinematics } from './observeRay';
export { deflectionAngle } from './deflection';
export { properTimeToSingularity, fallTimeToSingularity, radiusAtTimeLeft } from './properTime';
export {
  massScale,
  geometricTimeToSeconds,
  geometricAccelerationToG,
  geometricTidalToPerSecondSquared,
  radiusToSchwarzschildRadii,
  schwarzschildRadiiToRadius,
} from './units';
export type { MassScale } from './units';
export { radialTidalComponents, tidalTensor, symmetricEigenvalues3, riemannContract } from './tides';
export { RayTable, buildRayTableForRadialObserver, createRayLookup, FATE_SKY, FATE_HORIZON, FATE_FAR_SIDE } from './rayTable';
export type { RayLookup, RayTableArrays } from './rayTable';
export { boostLookDirection } from './boost';
export { endDirection, latitudeLongitude, lookAngleFromRadial } from './skyGeometry';
export {
  cie1931Cmf,
  blackbodyXyz,
  xyzToLinearSrgb,
  encodeSrgb,
  blackbodyLinearSrgb,
  temperatureFromBMinusV,
  BlackbodyColourTable,
} from './colour';
export { buildWorldline, validateWorldline } from './worldline/build';
export type { Worldline, BuiltSegment } from './worldline/build';
export { sampleWorldline } from './worldline/sample';
export { distantObserverTime } from './worldline/distantTime';
export type { WorldlineSample } from './worldline/sample';
export { orbitBand } from './worldline/orbitBand';
export { decomposeFourVelocity, cameraTetradPG } from './worldline/cameraFrame';
export type { FrameDecomposition } from './worldline/cameraFrame';
export type {
  WorldlineSpec,
  WorldlineSegment,
  WorldlineIssue,
  OrbitBand,
  PathState,
  HoverSegment,
  CircularOrbitSegment,
  DropSegment,
  FallSegment,
  FreeFallSegment,
  HoldSegment,
} from './worldline/types';

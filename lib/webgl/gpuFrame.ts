/**
 * Everything of a frame that depends only on the camera state and the
 * request, computed once per frame on the CPU and handed to the GPU as
 * uniforms and a small float texture: projection constants, orientation
 * matrices, the reference observer and boost, the packed ray table, exposure,
 * tone mapping and overlay settings. The per-pixel work is left to
 * shaders/sky.lensed.frag and shaders/sky.directions.frag.
 */
import type { FrameRequest } from '../render/schema';
import { engineCameraOptics, engineRayTableArrays } from '../render/engine';
import { cameraToHoleFromAxes, cameraToHoleMatrix, viewToCameraMatrix } from '../render/orientation';
import { exposureScale } from '../render/toneMap';
import { hexToLinear } from '../render/shade';
import { decomposeFourVelocity } from '../relativity';
import { packRayTable, type PackedRayTable } from './rayTableTexture';
import { projectionConstants, type ProjectionConstants } from './projectionConstants';

/** Tone-map codes of the shader (uToneMap). */
export const TONE_MAP_CODES = { none: 0, reinhard: 1, exponential: 2 } as const;

/** A grid overlay's uniforms. */
export interface GridUniforms {
  enabled: boolean;
  spacingRad: number;
  lineWidthPx: number;
  /** display-linear colour */
  colour: Float64Array;
  dashed: boolean;
}

/** Per-frame GPU inputs. */
export interface GpuFrame {
  width: number;
  height: number;
  projection: ProjectionConstants;
  /** view space -> camera frame, row-major 3x3 */
  viewToCamera: Float64Array;
  /** camera frame -> hole frame (J2000), row-major 3x3 */
  cameraToHole: Float64Array;
  /** camera velocity relative to the reference observer, camera-frame components, units of c (zero: no boost) */
  boostVelocity: Float64Array;
  lensing: boolean;
  colourShift: boolean;
  beaming: boolean;
  /** the packed ray table, or null when lensing is off */
  table: PackedRayTable | null;
  /** milliseconds spent building the engine's ray table for this frame */
  tableBuildMs: number;
  exposureScale: number;
  toneMap: number;
  supersampling: number;
  horizonGrid: GridUniforms;
  farSideGrid: GridUniforms;
}

function gridUniforms(grid: FrameRequest['effects']['horizonGrid']): GridUniforms {
  return {
    enabled: grid.enabled,
    spacingRad: (grid.spacingDeg * Math.PI) / 180,
    lineWidthPx: grid.lineWidthPx,
    colour: hexToLinear(grid.colour),
    dashed: grid.dashed,
  };
}

/**
 * Camera velocity relative to its radial reference observer, as lib/render's
 * engineCameraOptics builds it for its boost (lib/relativity decomposeFourVelocity).
 * @param state validated camera state
 * @returns 3-velocity in camera-frame components (e1, e2, e3), units of c
 */
export function boostVelocityOf(state: FrameRequest['camera']['state']): Float64Array {
  const v = new Float64Array(3);
  if (state.kind === 'hover' || state.kind === 'radial') return v;
  const r = state.radiusM;
  let ur: number;
  let angle = 0;
  if (state.kind === 'fourVelocity') {
    const f = 1 - 2 / r;
    const radial2 = state.energy * state.energy - f * (1 + (state.angularMomentum / r) ** 2);
    ur = (state.direction === 'out' ? 1 : -1) * Math.sqrt(Math.max(0, radial2));
    angle = (state.motionAngleDeg * Math.PI) / 180;
  } else {
    ur = state.ur;
  }
  const d = decomposeFourVelocity(r, state.energy, state.angularMomentum, ur);
  v[1] = d.tangentialSpeed * Math.cos(angle);
  v[2] = d.tangentialSpeed * Math.sin(angle);
  return v;
}

/**
 * Prepare the GPU inputs of a frame.
 * @param req validated frame request (lib/render parseFrameRequest)
 * @param reuse previous frame's result; its ray-table buffers are reused
 * @returns uniforms and table for the shaders
 * @throws RangeError for impossible camera states (from lib/render engineCameraOptics)
 */
export function prepareGpuFrame(req: FrameRequest, reuse?: GpuFrame): GpuFrame {
  const optics = engineCameraOptics(req.camera.state);
  const state = req.camera.state;
  const cameraToHole =
    state.kind === 'sample'
      ? cameraToHoleFromAxes(state.radialAxis, state.tangentAxis)
      : cameraToHoleMatrix(req.camera.holeDirection.raDeg, req.camera.holeDirection.decDeg);
  let table: PackedRayTable | null = null;
  let tableBuildMs = 0;
  if (req.effects.lensing) {
    const t0 = performance.now();
    const arrays = engineRayTableArrays(optics);
    tableBuildMs = performance.now() - t0;
    table = packRayTable(arrays, reuse?.table ?? undefined);
  }
  return {
    width: req.width,
    height: req.height,
    projection: projectionConstants(req.projection, req.width, req.height),
    viewToCamera: viewToCameraMatrix(req),
    cameraToHole,
    boostVelocity: optics.boost ? boostVelocityOf(state) : new Float64Array(3),
    lensing: req.effects.lensing,
    colourShift: req.effects.colourShift,
    beaming: req.effects.beaming,
    table,
    tableBuildMs,
    exposureScale: exposureScale(req.exposure.ev),
    toneMap: TONE_MAP_CODES[req.exposure.toneMap],
    supersampling: req.supersampling,
    horizonGrid: gridUniforms(req.effects.horizonGrid),
    farSideGrid: gridUniforms(req.effects.farSideGrid),
  };
}

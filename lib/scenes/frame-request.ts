/**
 * From a scene to the renderer: the lib/render FrameRequest of the frame seen
 * at a proper time (or screen time) along the scene's path, with the look
 * keyframes and pacing curve applied. Pure TypeScript: the editor's preview,
 * the render queue and tests build the same request from the same spec.
 */
import { sampleWorldline, type Worldline } from '@/lib/relativity';
import { frameRequestSchema, type FrameRequest, type Projection } from '@/lib/render/schema';
import type { SceneSpec } from './schema';
import { lookAt } from './look';
import { buildPacingCurve, properTimeAt, screenTimeAt, type PacingCurve } from './pacing';

/** How a scene's proper time maps onto the shot. */
export interface SceneTiming {
  curve: PacingCurve;
  /** proper-time length of the path, M */
  pathDurationM: number;
  /** screen time at the path's start and end, s */
  screenStartS: number;
  screenEndS: number;
}

/**
 * Fraction of the path's length kept clear of a singularity at its end: no
 * frame or readout exists at r = 0, so the last frame is taken just before it.
 */
export const SINGULARITY_MARGIN_FRACTION = 1e-6;

/**
 * The pacing curve of a scene and the screen-time span of its path.
 * @param spec validated scene (pacing handles in M and s)
 * @param worldline the scene's built path (sceneWorldline)
 * @returns timing; screenEndS > screenStartS
 */
export function sceneTiming(spec: Pick<SceneSpec, 'pacing'>, worldline: Worldline): SceneTiming {
  const curve = buildPacingCurve(spec.pacing.points);
  return { curve, pathDurationM: worldline.duration, screenStartS: screenTimeAt(curve, 0), screenEndS: screenTimeAt(curve, worldline.duration) };
}

/**
 * A proper time clamped onto the path, kept clear of a singularity at its end.
 * @param worldline built path
 * @param tauM proper time, M (finite)
 * @returns tau in [0, duration] (or just short of it when the path ends at r = 0)
 */
export function clampToPath(worldline: Worldline, tauM: number): number {
  if (!Number.isFinite(tauM)) throw new RangeError('tauM: a finite proper time (M)');
  const end = worldline.endsAtSingularity ? worldline.duration * (1 - SINGULARITY_MARGIN_FRACTION) : worldline.duration;
  return Math.min(Math.max(tauM, 0), end);
}

/**
 * Proper time shown at a screen time.
 * @param timing from sceneTiming
 * @param worldline built path
 * @param screenTimeS screen time, s (finite; clamped to the shot)
 * @returns proper time on the path, M
 */
export function properTimeAtScreen(timing: SceneTiming, worldline: Worldline, screenTimeS: number): number {
  if (!Number.isFinite(screenTimeS)) throw new RangeError('screenTimeS: a finite screen time (s)');
  const s = Math.min(Math.max(screenTimeS, timing.screenStartS), timing.screenEndS);
  return clampToPath(worldline, properTimeAt(timing.curve, s));
}

/**
 * Frame size for a projection inside a box: dome masters and cube faces are
 * square, equirectangular frames 2:1, flat frames fill the box.
 * @param projection the scene's projection
 * @param maxWidth box width, px (integer >= 1)
 * @param maxHeight box height, px (integer >= 1)
 * @returns integer width and height
 */
export function frameSizeFor(projection: Projection, maxWidth: number, maxHeight: number): { width: number; height: number } {
  if (!Number.isInteger(maxWidth) || maxWidth < 1) throw new RangeError('maxWidth: an integer >= 1 (px)');
  if (!Number.isInteger(maxHeight) || maxHeight < 1) throw new RangeError('maxHeight: an integer >= 1 (px)');
  if (projection.kind === 'dome' || projection.kind === 'cubeFace') {
    const side = Math.min(maxWidth, maxHeight);
    return { width: side, height: side };
  }
  if (projection.kind === 'equirect') {
    const width = Math.min(maxWidth, 2 * maxHeight);
    return { width, height: Math.max(1, Math.round(width / 2)) };
  }
  return { width: maxWidth, height: maxHeight };
}

/** Options of a built request. */
export interface FrameRequestOptions {
  /** samples per pixel per axis, 1..4 (default 1) */
  supersampling?: number;
}

/**
 * The frame request at proper time tau along the scene's path.
 * The camera is the worldline sample there (position, 4-velocity, axes); the
 * look, up, roll and (flat projections) field of view come from the look
 * keyframes; sky, effects and exposure from the scene.
 * @param spec validated scene
 * @param worldline the scene's built path
 * @param tauM proper time, M (clamped onto the path)
 * @param size frame width and height in px (integers 1..8192)
 * @param options supersampling
 * @returns a validated FrameRequest (lib/render frameRequestSchema)
 * @throws RangeError naming the field when the request is invalid
 */
export function frameRequestAt(spec: SceneSpec, worldline: Worldline, tauM: number, size: { width: number; height: number }, options: FrameRequestOptions = {}): FrameRequest {
  const tau = clampToPath(worldline, tauM);
  const sample = sampleWorldline(worldline, tau);
  const look = lookAt(spec.look.keyframes, tau);
  const projection: Projection = spec.projection.kind === 'flat' ? { kind: 'flat', fovDeg: look.fovDeg } : spec.projection;
  const result = frameRequestSchema.safeParse({
    massSolar: spec.massSolar,
    camera: {
      state: {
        kind: 'sample',
        radiusM: sample.state.r,
        energy: sample.state.energy,
        angularMomentum: sample.state.angularMomentum,
        ur: sample.state.ur,
        radialAxis: Array.from(sample.radialAxis),
        tangentAxis: Array.from(sample.tangentAxis),
      },
      look: look.look,
      up: look.up,
      rollDeg: look.rollDeg,
    },
    projection,
    width: size.width,
    height: size.height,
    sky: spec.sky,
    effects: spec.effects,
    exposure: spec.exposure,
    supersampling: options.supersampling ?? 1,
  });
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new RangeError(`frame request: ${issue.path.join('.') || '(root)'}: ${issue.message}`);
  }
  return result.data;
}

/**
 * The frame request seen at a screen time of the shot (pacing curve applied).
 * @param spec validated scene
 * @param worldline the scene's built path
 * @param timing from sceneTiming
 * @param screenTimeS screen time, s (clamped to the shot)
 * @param size frame size in px
 * @param options supersampling
 * @returns the request and the proper time it shows (M)
 */
export function frameRequestAtScreenTime(
  spec: SceneSpec,
  worldline: Worldline,
  timing: SceneTiming,
  screenTimeS: number,
  size: { width: number; height: number },
  options: FrameRequestOptions = {},
): { request: FrameRequest; tauM: number } {
  const tauM = properTimeAtScreen(timing, worldline, screenTimeS);
  return { request: frameRequestAt(spec, worldline, tauM, size, options), tauM };
}

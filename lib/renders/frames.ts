import { frameRequestAt, properTimeAtScreen, sceneTiming } from '@/lib/scenes/frame-request';
import { sceneWorldline } from '@/lib/scenes/readout';
import type { SceneSpec } from '@/lib/scenes/schema';
import type { Worldline } from '@/lib/relativity';
import type { FrameRequest } from '@/lib/render/schema';
import type { RenderSettings } from './settings';

/** Frames in a scene's sequence: the path's screen length (pacing curve) times the frame rate, at least one. */
export function sequenceFrameCount(spec: SceneSpec): number {
  const timing = sceneTiming(spec, sceneWorldline(spec));
  return Math.max(1, Math.floor((timing.screenEndS - timing.screenStartS) * spec.pacing.frameRate + 1e-9));
}

/**
 * Proper time (M) shown by frame `index`: screen time index / fps from the shot's start, through the pacing curve.
 * @param worldline the spec's path, when the caller already has it built
 */
export function properTimeOfFrame(spec: SceneSpec, index: number, worldline: Worldline = sceneWorldline(spec)): number {
  const timing = sceneTiming(spec, worldline);
  return properTimeAtScreen(timing, worldline, timing.screenStartS + index / spec.pacing.frameRate);
}

/**
 * The renderer's request for one frame of a render job (the editor preview uses the same builder).
 * @param worldline the spec's path, when the caller already has it built
 */
export function renderRequestFor(spec: SceneSpec, tauM: number, settings: RenderSettings, worldline: Worldline = sceneWorldline(spec)): FrameRequest {
  const request = frameRequestAt(spec, worldline, tauM, { width: settings.width, height: settings.height }, { supersampling: settings.supersampling });
  return { ...request, output: { ...request.output, format: settings.format } };
}

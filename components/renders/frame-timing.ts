/**
 * Frames of a scene revision for the render form: how many there are, and
 * which frame shows a given proper time on the traveller's clock. The same
 * pacing curve the workers use (lib/renders/frames.ts), run in the browser.
 */
import { massScale } from '@/lib/relativity/units';
import { properTimeOfFrame, sequenceFrameCount } from '@/lib/renders/frames';
import { sceneTiming } from '@/lib/scenes/frame-request';
import { screenTimeAt } from '@/lib/scenes/pacing';
import { sceneWorldline } from '@/lib/scenes/readout';
import type { SceneSpec } from '@/lib/scenes/schema';

export type SceneFrames = {
  /** frames in the whole sequence (>= 1) */
  frameCount: number;
  /** frames per second of the shot */
  frameRate: number;
  /** the path's proper-time length, seconds on the traveller's clock */
  properDurationSeconds: number;
  /** frame index showing a proper time (seconds, clamped onto the path) */
  frameAtProperTime: (properTimeSeconds: number) => number;
  /** proper time (seconds) shown by a frame index */
  properTimeOfFrameSeconds: (index: number) => number;
};

/**
 * Frame bookkeeping of a revision.
 * @param spec the revision's validated scene spec
 * @returns frame count, rate and the proper time <-> frame mapping (seconds of proper time for the scene's mass)
 * Reference: product.md flow 2 (pacing: screen time against proper time); frame i is at screen time i / fps from the shot's start.
 */
export function sceneFrames(spec: SceneSpec): SceneFrames {
  const worldline = sceneWorldline(spec);
  const timing = sceneTiming(spec, worldline);
  const { secondsPerM } = massScale(spec.massSolar);
  const frameCount = sequenceFrameCount(spec);
  const fps = spec.pacing.frameRate;
  return {
    frameCount,
    frameRate: fps,
    properDurationSeconds: worldline.duration * secondsPerM,
    frameAtProperTime: (properTimeSeconds) => {
      if (!Number.isFinite(properTimeSeconds) || properTimeSeconds < 0) throw new RangeError('properTimeSeconds: a proper time of 0 s or more');
      const tauM = Math.min(properTimeSeconds / secondsPerM, worldline.duration);
      const frame = Math.round((screenTimeAt(timing.curve, tauM) - timing.screenStartS) * fps);
      return Math.min(Math.max(frame, 0), frameCount - 1);
    },
    properTimeOfFrameSeconds: (index) => {
      if (!Number.isInteger(index) || index < 0 || index >= frameCount) throw new RangeError(`index: a frame number from 0 to ${frameCount - 1}`);
      return properTimeOfFrame(spec, index) * secondsPerM;
    },
  };
}

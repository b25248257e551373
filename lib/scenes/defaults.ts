import type { SceneSpecInput } from './schema';

/** Looking straight at the hole from the camera (camera frame: e1 outward). */
export const LOOK_AT_HOLE = { look: [-1, 0, 0] as [number, number, number], up: [0, 0, 1] as [number, number, number] };

/**
 * What a new scene starts as: hovering at 40 r_s (80 M) around a 4.1 million
 * solar-mass hole, looking at it, 10 s of screen time.
 */
export function defaultSceneSpec(): SceneSpecInput {
  return {
    massSolar: 4.1e6,
    path: { segments: [{ kind: 'hover', r: 80, duration: 100 }] },
    look: { keyframes: [{ tau: 0, ...LOOK_AT_HOLE, fovDeg: 60, rollDeg: 0 }] },
    projection: { kind: 'flat', fovDeg: 60 },
    pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 100, screenTime: 10 }] },
    notes: '',
  };
}

import type { SceneSpecInput } from '@/lib/scenes/schema';
import { LOOK_AT_HOLE } from '@/lib/scenes/defaults';

/** The invented demo show of product.md: "The Long Fall", about K-7 and a 12 solar-mass hole. */
export const DEMO_SHOW_NAME = 'The Long Fall';

const K7_MASS_SOLAR = 4.1e6;
const SMALL_HOLE_MASS_SOLAR = 12;
const dome = { kind: 'dome' as const, apertureDeg: 180, tiltDeg: 0 };
const keyframe = (tau: number, fovDeg = 60) => ({ tau, ...LOOK_AT_HOLE, fovDeg, rollDeg: 0 });

/**
 * The four demo scenes. Radii and proper times in M. Rain speed at 80 M is
 * sqrt(2/80) = 0.158 c (an observer falling from rest at infinity, physics.md 3).
 */
export const DEMO_SCENES: ReadonlyArray<{ name: string; slug: string; spec: SceneSpecInput }> = [
  {
    name: 'Approach from 40 r_s',
    slug: 'approach-from-40-rs',
    spec: {
      massSolar: K7_MASS_SOLAR,
      path: { segments: [{ kind: 'fall', r: 80, speed: Math.sqrt(2 / 80), duration: 300 }] },
      look: { keyframes: [keyframe(0, 50), keyframe(300, 90)] },
      projection: dome,
      pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 300, screenTime: 40 }] },
      notes: 'Opening shot: K-7 grows from a dark speck to a lensed ring as we fall in from rest at infinity.',
    },
  },
  {
    name: 'Hover near the photon sphere',
    slug: 'hover-near-the-photon-sphere',
    spec: {
      massSolar: K7_MASS_SOLAR,
      path: { segments: [{ kind: 'hover', r: 3.2, duration: 60 }] },
      look: { keyframes: [keyframe(0, 90), { tau: 60, look: [0, 1, 0], up: [0, 0, 1], fovDeg: 90, rollDeg: 0 }] },
      projection: dome,
      pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 60, screenTime: 30 }] },
      notes: 'Rockets hold us at 1.6 r_s; the shadow fills nearly half the sky and the stars crowd into a bright band around it.',
    },
  },
  {
    name: 'Drop through the horizon',
    slug: 'drop-through-the-horizon',
    spec: {
      massSolar: SMALL_HOLE_MASS_SOLAR,
      path: { segments: [{ kind: 'drop', r: 6, duration: 15 }] },
      look: { keyframes: [keyframe(0, 70)] },
      projection: { kind: 'flat', fovDeg: 70 },
      pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 15, screenTime: 20 }] },
      notes: 'Released at rest at the ISCO radius of a 12 solar-mass hole; we cross the horizon with no local event marking it.',
    },
  },
  {
    name: 'Last second before the singularity',
    slug: 'last-second-before-the-singularity',
    spec: {
      massSolar: K7_MASS_SOLAR,
      path: { segments: [{ kind: 'drop', r: 2.2 }] },
      look: { keyframes: [keyframe(0, 90)] },
      projection: dome,
      // K-7's M is about 20.2 s: the last 0.05 M (about one second) gets most of the screen time.
      pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 3.5, screenTime: 10 }, { properTime: 3.62, screenTime: 40 }] },
      notes: 'Inside the horizon of K-7: the countdown runs out and the tidal stretch passes any body in the last tenth of a second.',
    },
  },
];

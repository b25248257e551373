import { describe, expect, it } from 'vitest';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { sceneWorldline } from '@/lib/scenes/readout';
import { frameRequestAt, frameRequestAtScreenTime, frameSizeFor, sceneTiming } from '@/lib/scenes/frame-request';
import { frameRequestSchema } from '@/lib/render/schema';
import { near } from './tolerance';

function demo(slug: string) {
  const spec = sceneSpecSchema.parse(DEMO_SCENES.find((d) => d.slug === slug)!.spec);
  const worldline = sceneWorldline(spec);
  return { spec, worldline, timing: sceneTiming(spec, worldline) };
}

/** Radius of a drop from rest at R after proper time tau: the cycloid r = (R/2)(1 + cos eta), tau = sqrt(R^3/8)(eta + sin eta) (MTW 1973 ch. 25; physics.md section 3). */
function cycloidRadius(R: number, tau: number): number {
  const scale = Math.sqrt((R * R * R) / 8);
  let lo = 0;
  let hi = Math.PI;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (scale * (mid + Math.sin(mid)) < tau) lo = mid;
    else hi = mid;
  }
  return (R / 2) * (1 + Math.cos((lo + hi) / 2));
}

describe('frameRequestAt', () => {
  it('should build requests that lib/render frameRequestSchema accepts for every demo scene along its whole shot', () => {
    for (const d of DEMO_SCENES) {
      const { spec, worldline, timing } = demo(d.slug);
      const size = frameSizeFor(spec.projection, 64, 36);
      for (let i = 0; i <= 10; i++) {
        const s = timing.screenStartS + ((timing.screenEndS - timing.screenStartS) * i) / 10;
        const { request } = frameRequestAtScreenTime(spec, worldline, timing, s, size);
        const reparsed = frameRequestSchema.safeParse(request);
        expect(reparsed.success, `${d.slug} at ${s} s`).toBe(true);
      }
    }
  });

  it('should put the camera of "Drop through the horizon" on the closed-form cycloid of a drop from rest at 6 M (MTW ch. 25)', () => {
    const { spec, worldline, timing } = demo('drop-through-the-horizon');
    let worst = 0;
    for (const s of [0, 5, 10, 15, 19.9]) {
      const { request, tauM } = frameRequestAtScreenTime(spec, worldline, timing, s, { width: 32, height: 18 });
      // The demo paces 15 M of proper time over 20 s of screen, evenly.
      expect(near(tauM, (15 * s) / 20, 1e-9, 1e-9)).toBe(true);
      const expected = cycloidRadius(6, tauM);
      worst = Math.max(worst, Math.abs(request.camera.state.radiusM - expected) / expected);
    }
    console.log(`frame request radius vs cycloid worst relative error ${worst}`);
    expect(worst).toBeLessThan(1e-6);
  });

  it('should take the flat field of view from the look keyframes and keep a dome projection as stored', () => {
    const drop = demo('drop-through-the-horizon');
    const flat = frameRequestAt(drop.spec, drop.worldline, 3, { width: 32, height: 18 });
    expect(flat.projection).toEqual({ kind: 'flat', fovDeg: 70 });
    const approach = demo('approach-from-40-rs');
    const dome = frameRequestAt(approach.spec, approach.worldline, 150, { width: 32, height: 32 });
    expect(dome.projection).toEqual({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 });
    expect(near(dome.camera.look[0] ** 2 + dome.camera.look[1] ** 2 + dome.camera.look[2] ** 2, 1, 1e-12)).toBe(true);
  });

  it('should stop just short of the singularity at the end of "Last second before the singularity"', () => {
    const { spec, worldline, timing } = demo('last-second-before-the-singularity');
    const { request, tauM } = frameRequestAtScreenTime(spec, worldline, timing, timing.screenEndS, { width: 32, height: 32 });
    expect(tauM).toBeLessThan(worldline.duration);
    expect(request.camera.state.radiusM).toBeGreaterThan(0);
    // pi sqrt(R^3/8) for R = 2.2 M (MTW ch. 31 cycloid, total fall time)
    expect(near(worldline.duration, Math.PI * Math.sqrt(2.2 ** 3 / 8), 1e-9, 1e-9)).toBe(true);
  });

  it('should make dome frames square and refuse a bad size', () => {
    expect(frameSizeFor({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, 640, 360)).toEqual({ width: 360, height: 360 });
    expect(frameSizeFor({ kind: 'equirect' }, 640, 360)).toEqual({ width: 640, height: 320 });
    expect(() => frameSizeFor({ kind: 'flat', fovDeg: 60 }, 0, 10)).toThrow(RangeError);
  });
});

import { describe, expect, it } from 'vitest';
import { sceneSpecSchema, type SceneSpecInput } from '@/lib/scenes/schema';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { DEMO_SCENES } from '@/lib/demo/scenes';

// Physical limits from physics.md sections 2-3: horizon r = 2 M, photon sphere r = 3 M, |v| < c.
function issuesFor(change: (spec: SceneSpecInput) => void) {
  const spec = structuredClone(defaultSceneSpec());
  change(spec);
  const result = sceneSpecSchema.safeParse(spec);
  return result.success ? [] : result.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

describe('sceneSpecSchema', () => {
  it('should accept the default scene and all four demo scenes', () => {
    expect(issuesFor(() => {})).toEqual([]);
    for (const demo of DEMO_SCENES) expect(sceneSpecSchema.safeParse(demo.spec).success, demo.slug).toBe(true);
  });

  it('should refuse a speed at or above light speed at the field', () => {
    const issues = issuesFor((s) => { s.path.segments = [{ kind: 'fall', r: 20, speed: 1 }]; });
    expect(issues).toContainEqual({ path: 'path.segments.0.speed', message: 'speed must be below the speed of light (< 1 c)' });
  });

  it('should keep a fall that runs until a radius, and say at the field when it cannot get there', () => {
    // a drop from 10 M until 4 M (MTW 1973 eq. 31.10 gives its proper time; tests/unit/relativity/untilRadius.test.ts)
    expect(issuesFor((s) => { s.path.segments = [{ kind: 'drop', r: 10, untilR: 4 }]; })).toEqual([]);
    expect(issuesFor((s) => { s.path.segments = [{ kind: 'drop', r: 10, untilR: 0 }]; })).toContainEqual({ path: 'path.segments.0.untilR', message: 'the radius to reach must be positive (M)' });
    expect(issuesFor((s) => { s.path.segments = [{ kind: 'drop', r: 10, untilR: 12 }]; })).toContainEqual({
      path: 'path.segments.0.untilR',
      message: 'must be below the radius the fall starts from (r = 10 M): a radial fall only moves inward',
    });
    // only falls have a radius to reach
    expect(issuesFor((s) => { s.path.segments = [{ kind: 'hover', r: 10, duration: 5, untilR: 4 } as never]; }).map((i) => i.path)).toContain('path.segments.0');
  });

  it('should refuse a hover at or inside the horizon at the field', () => {
    for (const r of [2, 1.5]) {
      const issues = issuesFor((s) => { s.path.segments = [{ kind: 'hover', r, duration: 10 }]; });
      expect(issues).toContainEqual({ path: 'path.segments.0.r', message: 'a hover must be outside the event horizon: r > 2 M (1 r_s)' });
    }
  });

  it('should refuse a circular orbit inside the photon sphere at the field', () => {
    const issues = issuesFor((s) => { s.path.segments = [{ kind: 'circular-orbit', r: 2.9, duration: 10 }]; });
    expect(issues).toContainEqual({ path: 'path.segments.0.r', message: 'a circular orbit must lie outside the photon sphere: r > 3 M (1.5 r_s)' });
  });

  it('should refuse a mass that is zero or negative', () => {
    for (const massSolar of [0, -4]) {
      expect(issuesFor((s) => { s.massSolar = massSolar; })).toContainEqual({ path: 'massSolar', message: 'mass must be greater than zero solar masses' });
    }
  });

  it('should refuse a segment that starts where the previous one cannot reach', () => {
    // A drop from rest at 10 M only falls inward: a hover at 20 M cannot follow it.
    const issues = issuesFor((s) => { s.path.segments = [{ kind: 'drop', r: 10, duration: 5 }, { kind: 'hover', r: 20, duration: 5 }]; });
    expect(issues.some((i) => i.path.startsWith('path.segments.1'))).toBe(true);
  });

  it('should refuse pacing curves that do not increase', () => {
    const issues = issuesFor((s) => { s.pacing.points = [{ properTime: 0, screenTime: 0 }, { properTime: 50, screenTime: 5 }, { properTime: 40, screenTime: 8 }]; });
    expect(issues).toContainEqual({ path: 'pacing.points.2.properTime', message: 'proper times must increase along the pacing curve' });
  });

  it('should refuse unknown fields and frame rates outside the delivery formats', () => {
    expect(issuesFor((s) => { (s as Record<string, unknown>).colour = 'red'; })[0].path).toBe('');
    expect(issuesFor((s) => { s.pacing.frameRate = 48; })[0].message).toMatch(/24, 25, 29.97, 30, 60/);
  });
});

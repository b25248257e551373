import { describe, expect, it } from 'vitest';
import { buildRayTableForRadialObserver } from '@/lib/relativity';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { sceneWorldline } from '@/lib/scenes/readout';
import { buildAccuracyReport, explainNonPhysicalSetting, keyMoments, rayTableWorstError } from '@/lib/reviews/report';
import { expectClose } from '../relativity/support/tolerance';

/** The bound lib/relativity/README.md states for table lookups outside the shadow-edge band, rad. */
const TABLE_PHI_BOUND_RAD = 1e-7;

const demo = (slug: string) => sceneSpecSchema.parse(DEMO_SCENES.find((d) => d.slug === slug)!.spec);

describe('rayTableWorstError', () => {
  it('should find the table within its stated bound for hovering and falling cameras', () => {
    // Reference: the exact tracer observeRay (checked against Synge 1966 and odex in tests/unit/relativity).
    for (const [r, eps, ur] of [[6, Math.sqrt(2 / 3), 0], [3.2, Math.sqrt(1 - 2 / 3.2), 0], [10, 1, -Math.sqrt(0.2)], [1, 1, -Math.SQRT2]] as const) {
      const audit = rayTableWorstError(r, eps, ur, { samples: 2000 });
      console.log(`r = ${r}: worst |dphi| ${audit.worstPhiErrorRad.toExponential(2)} rad over ${audit.compared} angles`);
      expect(audit.skipped).toBeNull();
      expect(audit.compared).toBeGreaterThan(1990);
      expect(audit.fateMismatches).toBe(0);
      expect(audit.worstPhiErrorRad).toBeLessThan(TABLE_PHI_BOUND_RAD);
      expect(audit.worstShiftRelative).toBeLessThan(1e-12);
    }
  });

  it('should catch a table built for the wrong camera', () => {
    const wrong = buildRayTableForRadialObserver(6.5, null);
    const audit = rayTableWorstError(6, Math.sqrt(2 / 3), 0, { samples: 500, table: wrong });
    expect(audit.worstPhiErrorRad + audit.fateMismatches).toBeGreaterThan(1e-3);
  });

  it('should leave out the band round the shadow edge and say why outgoing cameras are skipped', () => {
    const audit = rayTableWorstError(6, Math.sqrt(2 / 3), 0, { samples: 1000, edgeBandRad: 0.01 });
    // Evenly spread angles, spacing pi/1000: a 0.02 rad band holds about 0.02/(pi/1000) = 6.4 of them.
    expect(audit.excludedNearEdge).toBeGreaterThanOrEqual(6);
    expect(audit.excludedNearEdge).toBeLessThanOrEqual(7);
    expect(rayTableWorstError(6, 1, Math.sqrt(1 - (1 - 2 / 6))).skipped).toMatch(/outward/);
    expect(() => rayTableWorstError(Number.NaN, 1, 0)).toThrow(RangeError);
  });
});

describe('keyMoments', () => {
  it('should put the horizon crossing of a drop from rest at 6 M where the cycloid does', () => {
    // MTW 1973 eq. 31.10 and Hartle 2003 ch. 9: r = (R/2)(1 + cos eta), tau = sqrt(R^3/8)(eta + sin eta).
    const worldline = sceneWorldline(demo('drop-through-the-horizon'));
    const moments = keyMoments(worldline);
    const horizon = moments.find((m) => m.kind === 'horizon');
    const R = 6;
    const eta = Math.acos((2 * 2) / R - 1);
    expectClose(horizon!.tauM, Math.sqrt(R ** 3 / 8) * (eta + Math.sin(eta)), 1e-8, 'horizon crossing tau (M)');
    expect(moments.map((m) => m.kind)).toEqual(['start', 'horizon', 'end']);
  });

  it('should list each joint and stop just short of the singularity', () => {
    const spec = sceneSpecSchema.parse({
      ...DEMO_SCENES[0].spec,
      path: { segments: [{ kind: 'hover', r: 10, duration: 5 }, { kind: 'hold', duration: 3 }, { kind: 'drop' }] },
      look: { keyframes: [{ tau: 0, look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 60, rollDeg: 0 }] },
    });
    const worldline = sceneWorldline(spec);
    const moments = keyMoments(worldline);
    expect(moments.map((m) => m.kind)).toEqual(['start', 'joint', 'joint', 'horizon', 'end']);
    expectClose(moments[1].tauM, 5, 1e-12, 'first joint');
    expectClose(moments[2].tauM, 8, 1e-12, 'second joint');
    // From rest at 10 M the whole fall lasts pi sqrt(10^3/8) (MTW eq. 31.10); the path ends there.
    expectClose(worldline.duration, 8 + Math.PI * Math.sqrt(1000 / 8), 1e-6, 'path length');
    expect(moments[4].tauM).toBeLessThan(worldline.duration);
    expect(moments[4].tauM).toBeGreaterThan(worldline.duration * (1 - 1e-5));
  });
});

describe('buildAccuracyReport', () => {
  it('should report the demo descent with readouts, audits, passing checks and every setting in force', () => {
    const report = buildAccuracyReport(demo('last-second-before-the-singularity'), { raySamples: 600 });
    expect(report.segments).toHaveLength(1);
    expectClose(report.segments[0].startRadiusRs, 1.1, 1e-12, 'start radius (r_s)');
    expect(report.moments[0].readout.radiusRs).toBeCloseTo(1.1, 9);
    // physics.md section 3: dropped from rest, eps = sqrt(1 - 2/R), so the speed past a hovering observer starts at 0.
    expectClose(report.moments[0].readout.speedRelativeToHover ?? Number.NaN, 0, 1e-6, 'speed at release');
    expect(report.moments.some((m) => m.moment.kind === 'horizon')).toBe(true);
    for (const m of report.moments) {
      expect(m.rayTable.skipped).toBeNull();
      expect(m.rayTable.fateMismatches).toBe(0);
      expect(m.rayTable.worstPhiErrorRad).toBeLessThan(TABLE_PHI_BOUND_RAD);
    }
    expect(report.checks.every((c) => c.passed)).toBe(true);
    expect(report.nonPhysical.map((s) => s.setting)).toContain('exposure 0 EV, tone mapping exponential');
    expect(report.idealisations.map((i) => i.title).join(' ')).toMatch(/eternal/i);
  });
});

describe('explainNonPhysicalSetting', () => {
  it('should explain each setting lib/render lists, and fall back for unknown ones', () => {
    expect(explainNonPhysicalSetting('lensing switched off (plain sky remap)')).toMatch(/bending of light/);
    expect(explainNonPhysicalSetting('far-side grid overlay')).toMatch(/far side/);
    expect(explainNonPhysicalSetting('something new')).toMatch(/not part of the physics/);
  });
});

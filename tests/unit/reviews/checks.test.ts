import { describe, expect, it } from 'vitest';
import { BOZZA_CONSTANT, bozzaStrongDeflection, evaluateCheck, PUBLISHED_CHECKS, runPublishedChecks, syngeShadowHalfAngle, type PublishedCheck } from '@/lib/reviews/checks';
import { expectClose } from '../relativity/support/tolerance';

const DEG = Math.PI / 180;

describe('runPublishedChecks', () => {
  it('should pass every published check the accuracy report shows', () => {
    const results = runPublishedChecks();
    expect(results.length).toBe(PUBLISHED_CHECKS.length);
    for (const result of results) {
      console.log(`${result.id}: computed ${result.computed} vs published ${result.published} (error ${result.error.toExponential(2)}, tolerance ${result.tolerance.toExponential(2)} ${result.unit})`);
      expectClose(result.computed, result.published, result.tolerance, result.title);
      expect(result.passed, result.id).toBe(true);
    }
  });

  it('should carry the published numbers quoted in physics.md', () => {
    const byId = new Map(PUBLISHED_CHECKS.map((c) => [c.id, c]));
    // physics.md section 5: Sun's limb 1.7512 arcsec (GM/c^2 = 1476.6 m, R = 6.957e8 m).
    expectClose(byId.get('solar-limb-deflection')!.published, 1.7512, 1e-12, 'solar limb');
    // Bozza 2002, PRD 66, 103001, table I: b-bar = -0.4002.
    expectClose(byId.get('bozza-constant')!.published, -0.4002, 1e-12, 'Bozza constant');
    // physics.md section 3 (MTW ch. 31): from rest at the horizon, 15.47 microseconds per solar mass.
    expectClose(byId.get('horizon-fall-time')!.published, 15.47, 1e-12, 'horizon fall');
    // MTW 1973 eq. 31.10: pi sqrt(R^3/8) at R = 10 M.
    expectClose(byId.get('cycloid-fall-time')!.published, Math.PI * Math.sqrt(125), 1e-12, 'cycloid');
  });
});

describe('evaluateCheck', () => {
  it('should fail a check whose engine value misses the published value or throws', () => {
    const base: PublishedCheck = { ...PUBLISHED_CHECKS[0] };
    const off = evaluateCheck({ ...base, compute: () => base.published + 3 * base.tolerance });
    expect(off.passed).toBe(false);
    const thrown = evaluateCheck({ ...base, compute: () => { throw new RangeError('broken'); } });
    expect(thrown.passed).toBe(false);
    expect(thrown.error).toBe(Number.POSITIVE_INFINITY);
    const nan = evaluateCheck({ ...base, compute: () => Number.NaN });
    expect(nan.passed).toBe(false);
  });
});

describe('syngeShadowHalfAngle', () => {
  it('should give 90 degrees at the photon sphere and the far-away limit 3 sqrt(3) M / r', () => {
    // Synge 1966, MNRAS 131, 463: at r = 3M the shadow covers half the sky.
    expectClose(syngeShadowHalfAngle(3), 90 * DEG, 1e-12, 'alpha at r = 3');
    // Far away sin(alpha) -> b_c / r (Hartle 2003 ch. 9: b_c = 3 sqrt(3) M).
    expectClose(syngeShadowHalfAngle(1e6), (3 * Math.sqrt(3)) / 1e6, 1e-11, 'alpha at r = 1e6');
    expect(syngeShadowHalfAngle(2.5)).toBeGreaterThan(90 * DEG);
    expect(() => syngeShadowHalfAngle(2)).toThrow(RangeError);
  });
});

describe('bozzaStrongDeflection', () => {
  it('should grow by ln 10 per decade closer to b_c and hold Bozza\'s constant', () => {
    // Bozza 2002: coefficient a = 1 for Schwarzschild, so each factor 10 closer adds ln 10.
    expectClose(bozzaStrongDeflection(1e-5) - bozzaStrongDeflection(1e-4), Math.log(10), 1e-12, 'slope');
    expectClose(bozzaStrongDeflection(1), BOZZA_CONSTANT, 1e-15, 'constant');
    expect(() => bozzaStrongDeflection(0)).toThrow(RangeError);
  });
});

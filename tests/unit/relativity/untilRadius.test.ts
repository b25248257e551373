import { describe, expect, it } from 'vitest';
import { buildWorldline, sampleWorldline, validateWorldline } from '@/lib/relativity';
import { expectRelative } from './support/tolerance';

// Falls that end where they first reach a radius (segment field untilR, M) instead of after a proper time.
describe('a fall until a radius', () => {
  it('should drop from rest at 10 M to 4 M in the proper time of the cycloid', () => {
    // MTW 1973 eq. 31.10: r = (r0/2)(1 + cos eta), tau = sqrt(r0^3 / 8M)(eta + sin eta).
    const r0 = 10;
    const target = 4;
    const eta = Math.acos((2 * target) / r0 - 1);
    const expected = Math.sqrt(r0 ** 3 / 8) * (eta + Math.sin(eta));
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'drop', r: r0, untilR: target }] });
    expectRelative(w.duration, expected, 1e-12, 'proper time from 10 M to 4 M');
    expectRelative(w.segments[0].end.r, target, 1e-9, 'radius at the end');
    expect(w.endsAtSingularity).toBe(false);
  });

  it('should fall from rest far away (speed sqrt(2M/r) at the start) in the proper time (2/3)(r0^1.5 - r1^1.5)/sqrt(2M)', () => {
    // Hartle 2003 eq. 9.38 (radial plunge with e = 1): r^{3/2} = r0^{3/2} - (3/2) sqrt(2M) tau. The speed a
    // hovering observer measures for e = 1 is sqrt(2M/r) (Hartle 2003, Example 9.3).
    const r0 = 20;
    const target = 5;
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'fall', r: r0, speed: Math.sqrt(2 / r0), untilR: target }] });
    expectRelative(w.duration, ((2 / 3) * (r0 ** 1.5 - target ** 1.5)) / Math.sqrt(2), 1e-12, 'proper time from 20 M to 5 M');
  });

  it('should end a captured free fall where it first reaches the radius, after following the geodesic', () => {
    // e = 1 and l = 3 M is captured (l < 4 M, Hartle 2003 Fig. 9.4: no barrier for e = 1 below l = 4M);
    // the end must sit on the radius and every earlier point outside it.
    const target = 3;
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'free-fall', r: 12, energy: 1, angularMomentum: 3, radialSense: 'in', untilR: target }] });
    expectRelative(w.segments[0].end.r, target, 1e-9, 'radius at the end');
    for (const fraction of [0.25, 0.5, 0.9, 0.999]) expect(sampleWorldline(w, fraction * w.duration).state.r).toBeGreaterThan(target);
    // chained: a hover cannot follow inside the horizon, but a further fall starts at the radius reached
    const chain = buildWorldline({
      massSolar: 1,
      segments: [
        { kind: 'free-fall', r: 12, energy: 1, angularMomentum: 3, radialSense: 'in', untilR: target },
        { kind: 'free-fall', energy: 1, angularMomentum: 3, radialSense: 'in' },
      ],
    });
    expectRelative(chain.segments[1].start.r, target, 1e-9, 'the next segment starts there');
  });

  it('should say why a radius cannot be the end of a fall', () => {
    // a radial fall only moves inward
    expect(validateWorldline({ massSolar: 1, segments: [{ kind: 'drop', r: 10, untilR: 12 }] })).toEqual([
      { path: 'segments[0].untilR', message: 'must be below the radius the fall starts from (r = 10 M): a radial fall only moves inward' },
    ]);
    // one length, not two
    expect(validateWorldline({ massSolar: 1, segments: [{ kind: 'drop', r: 10, duration: 5, untilR: 4 }] })[0]).toMatchObject({ path: 'segments[0].untilR', message: expect.stringMatching(/not both/) });
    // e = 1, l = 4.5 M > 4 M: the barrier turns the fall back at r = 7.38 M (the larger root of
    // -2 r^2 + l^2 r - 2 l^2 = 0, from e^2 = (1 - 2M/r)(1 + l^2/r^2)), so it never reaches the singularity
    expect(validateWorldline({ massSolar: 1, segments: [{ kind: 'free-fall', r: 30, energy: 1, angularMomentum: 4.5, radialSense: 'in', untilR: 5 }] })[0]).toMatchObject({
      path: 'segments[0].untilR',
      message: expect.stringMatching(/reaches the singularity/),
    });
    // captured, but starting inside the radius and moving inward: never passes it
    expect(validateWorldline({ massSolar: 1, segments: [{ kind: 'free-fall', r: 6, energy: 1, angularMomentum: 3, radialSense: 'in', untilR: 8 }] })[0]).toMatchObject({
      path: 'segments[0].untilR',
      message: expect.stringMatching(/never reached/),
    });
  });
});

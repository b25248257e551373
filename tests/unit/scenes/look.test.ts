import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { vec3 } from 'gl-matrix';
import { angleBetweenDeg, lookAt, slerpUnit, type Vector3 } from '@/lib/scenes/look';
import { near } from './tolerance';

const unitVector = fc
  .tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
  .filter(([x, y, z]) => Math.hypot(x, y, z) > 0.1)
  .map(([x, y, z]) => {
    const n = Math.hypot(x, y, z);
    return [x / n, y / n, z / n] as Vector3;
  });

describe('slerpUnit', () => {
  it('should agree with gl-matrix vec3.slerp (a general-purpose reference library) to 1e-6', () => {
    let worst = 0;
    fc.assert(
      fc.property(unitVector, unitVector, fc.double({ min: 0, max: 1, noNaN: true }), (a, b, t) => {
        // gl-matrix's formula divides by sin(angle): keep clear of (anti)parallel pairs where both are ill-conditioned.
        const angle = angleBetweenDeg(a, b);
        if (angle < 1 || angle > 179) return true;
        const ours = slerpUnit([0, 0, 0], a, b, t);
        const ref = vec3.slerp(vec3.create(), vec3.fromValues(...a), vec3.fromValues(...b), t);
        const error = Math.hypot(ours[0] - ref[0], ours[1] - ref[1], ours[2] - ref[2]);
        worst = Math.max(worst, error);
        return error < 1e-6; // gl-matrix stores Float32 components
      }),
      { numRuns: 500 },
    );
    console.log(`slerp vs gl-matrix worst difference ${worst}`);
  });

  it('should keep unit length for any pair, including opposite vectors (property)', () => {
    fc.assert(
      fc.property(unitVector, fc.boolean(), fc.double({ min: 0, max: 1, noNaN: true }), (a, opposite, t) => {
        const b: Vector3 = opposite ? [-a[0], -a[1], -a[2]] : [a[1], a[2], a[0]];
        const out = slerpUnit([0, 0, 0], a, b, t);
        return near(Math.hypot(...out), 1, 1e-12);
      }),
      { numRuns: 500 },
    );
  });

  it('should turn at a constant rate: angle(a, slerp(t)) = t angle(a, b) (Shoemake 1985)', () => {
    const a: Vector3 = [1, 0, 0];
    const b: Vector3 = [0, Math.SQRT1_2, Math.SQRT1_2];
    for (const t of [0.1, 0.25, 0.5, 0.9]) expect(near(angleBetweenDeg(a, slerpUnit([0, 0, 0], a, b, t)), 90 * t, 1e-9)).toBe(true);
  });
});

describe('lookAt', () => {
  const keyframes = [
    { tau: 0, look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 50, rollDeg: 0 },
    { tau: 60, look: [0, 1, 0], up: [0, 0, 1], fovDeg: 90, rollDeg: 10 },
  ];

  it('should return the keyframes exactly at their times and hold them outside', () => {
    expect(lookAt(keyframes, 0)).toEqual({ look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 50, rollDeg: 0 });
    expect(lookAt(keyframes, 60)).toEqual({ look: [0, 1, 0], up: [0, 0, 1], fovDeg: 90, rollDeg: 10 });
    expect(lookAt(keyframes, 500).fovDeg).toBe(90);
    expect(lookAt(keyframes, -1).look).toEqual([-1, 0, 0]);
  });

  it('should keep look and up unit vectors between keyframes (property)', () => {
    fc.assert(
      fc.property(unitVector, unitVector, unitVector, unitVector, fc.double({ min: 0, max: 10, noNaN: true }), (l0, u0, l1, u1, tau) => {
        const state = lookAt(
          [
            { tau: 0, look: l0, up: u0, fovDeg: 60 },
            { tau: 10, look: l1, up: u1, fovDeg: 60 },
          ],
          tau,
        );
        return near(Math.hypot(...state.look), 1, 1e-12) && near(Math.hypot(...state.up), 1, 1e-12);
      }),
      { numRuns: 300 },
    );
  });

  it('should be half-way in angle and field of view at the middle of a span (smoothstep is symmetric)', () => {
    const mid = lookAt(keyframes, 30);
    expect(near(angleBetweenDeg(mid.look, [-1, 0, 0]), 45, 1e-9)).toBe(true);
    expect(near(mid.fovDeg, 70, 1e-12)).toBe(true);
  });

  it('should use keyframes in time order whatever the list order', () => {
    expect(lookAt([...keyframes].reverse(), 15)).toEqual(lookAt(keyframes, 15));
  });

  it('should refuse an empty list, a zero vector and a non-finite time', () => {
    expect(() => lookAt([], 0)).toThrow(RangeError);
    expect(() => lookAt([{ tau: 0, look: [0, 0, 0], up: [0, 0, 1], fovDeg: 60 }], 0)).toThrow(/look/);
    expect(() => lookAt(keyframes, Number.NaN)).toThrow(RangeError);
  });
});

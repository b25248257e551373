import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildPacingCurve, paceAt, properTimeAt, screenTimeAt, slowDownNearEnd } from '@/lib/scenes/pacing';
import { near } from './tolerance';

/**
 * Fritsch & Carlson 1980 (SIAM J. Numer. Anal. 17, 238) "RPN 15A" radiochemical
 * data, the classic case where an ordinary cubic spline overshoots and a
 * monotone interpolant must not (values from memory).
 */
const RPN15A_X = [7.99, 8.09, 8.19, 8.7, 9.2, 10, 12, 15, 20];
const RPN15A_Y = [0, 2.76429e-5, 4.37498e-2, 0.169183, 0.469428, 0.94374, 0.998636, 0.999919, 0.999994];

/** Increasing handles from fast-check: positive gaps accumulated in both coordinates. */
const handles = fc
  .array(fc.tuple(fc.double({ min: 1e-3, max: 50, noNaN: true }), fc.double({ min: 1e-3, max: 50, noNaN: true })), { minLength: 1, maxLength: 8 })
  .map((gaps) => {
    const points = [{ properTime: 0, screenTime: 0 }];
    for (const [dt, ds] of gaps) {
      const last = points[points.length - 1];
      points.push({ properTime: last.properTime + dt, screenTime: last.screenTime + ds });
    }
    return points;
  });

describe('screenTimeAt', () => {
  it('should pass exactly through every handle', () => {
    const points = [{ properTime: 0, screenTime: 0 }, { properTime: 3.5, screenTime: 10 }, { properTime: 3.62, screenTime: 40 }];
    const curve = buildPacingCurve(points);
    for (const p of points) expect(near(screenTimeAt(curve, p.properTime), p.screenTime, 1e-12, 1e-12)).toBe(true);
  });

  it('should reproduce collinear handles as a straight line (Fritsch & Carlson 1980: linear data give the linear interpolant)', () => {
    const curve = buildPacingCurve([0, 1, 2.5, 7].map((t) => ({ properTime: t, screenTime: 4 * t + 1 })));
    let maxError = 0;
    for (let t = 0; t <= 7; t += 0.01) maxError = Math.max(maxError, Math.abs(screenTimeAt(curve, t) - (4 * t + 1)));
    console.log(`pacing linear reproduction max error ${maxError}`);
    expect(maxError).toBeLessThan(1e-12);
  });

  it('should stay monotone and inside each span on the RPN 15A data where a plain cubic spline overshoots', () => {
    const curve = buildPacingCurve(RPN15A_X.map((x, i) => ({ properTime: x, screenTime: RPN15A_Y[i] })));
    let previous = -Infinity;
    let violations = 0;
    for (let i = 0; i < RPN15A_X.length - 1; i++) {
      for (let k = 0; k <= 200; k++) {
        const x = RPN15A_X[i] + ((RPN15A_X[i + 1] - RPN15A_X[i]) * k) / 200;
        const y = screenTimeAt(curve, x);
        if (y < previous - 1e-15 || y < RPN15A_Y[i] - 1e-15 || y > RPN15A_Y[i + 1] + 1e-15) violations++;
        previous = y;
      }
    }
    expect(violations).toBe(0);
  });

  it('should be strictly increasing for any increasing handles (property)', () => {
    fc.assert(
      fc.property(handles, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (points, a, b) => {
        const curve = buildPacingCurve(points);
        const end = points[points.length - 1].properTime;
        const [lo, hi] = a < b ? [a * end, b * end] : [b * end, a * end];
        if (hi - lo < 1e-9 * end) return true;
        return screenTimeAt(curve, hi) > screenTimeAt(curve, lo);
      }),
      { numRuns: 300 },
    );
  });

  it('should continue straight beyond the last handle with the last span slope', () => {
    const curve = buildPacingCurve([{ properTime: 0, screenTime: 0 }, { properTime: 10, screenTime: 5 }, { properTime: 20, screenTime: 30 }]);
    expect(near(screenTimeAt(curve, 24), 30 + 4 * 2.5, 1e-12)).toBe(true);
    expect(near(paceAt(curve, 24), 2.5, 1e-12)).toBe(true);
  });

  it('should refuse non-finite input and handles that do not increase', () => {
    const curve = buildPacingCurve([{ properTime: 0, screenTime: 0 }, { properTime: 1, screenTime: 1 }]);
    expect(() => screenTimeAt(curve, Number.NaN)).toThrow(RangeError);
    expect(() => buildPacingCurve([{ properTime: 0, screenTime: 0 }, { properTime: 0, screenTime: 1 }])).toThrow(/points\[1\]\.properTime/);
    expect(() => buildPacingCurve([{ properTime: 0, screenTime: 2 }, { properTime: 1, screenTime: 1 }])).toThrow(/points\[1\]\.screenTime/);
  });
});

describe('properTimeAt', () => {
  it('should invert screenTimeAt to 1e-9 relative for any increasing handles (property)', () => {
    let worst = 0;
    fc.assert(
      fc.property(handles, fc.double({ min: -0.2, max: 1.2, noNaN: true }), (points, u) => {
        const curve = buildPacingCurve(points);
        const tau = u * points[points.length - 1].properTime;
        const back = properTimeAt(curve, screenTimeAt(curve, tau));
        const error = Math.abs(back - tau) / Math.max(1, points[points.length - 1].properTime);
        worst = Math.max(worst, error);
        return error < 1e-9;
      }),
      { numRuns: 400 },
    );
    console.log(`pacing inverse worst relative error ${worst}`);
  });

  it('should map the handles back to their proper times on the demo "last second" curve', () => {
    const points = [{ properTime: 0, screenTime: 0 }, { properTime: 3.5, screenTime: 10 }, { properTime: 3.62, screenTime: 40 }];
    const curve = buildPacingCurve(points);
    for (const p of points) expect(near(properTimeAt(curve, p.screenTime), p.properTime, 1e-12, 1e-12)).toBe(true);
  });
});

describe('slowDownNearEnd', () => {
  it('should give most screen time to the end: the last fifth of proper time gets more screen than the first fifth', () => {
    const curve = buildPacingCurve(slowDownNearEnd(100, 30, 3, 6));
    const first = screenTimeAt(curve, 20) - screenTimeAt(curve, 0);
    const last = screenTimeAt(curve, 100) - screenTimeAt(curve, 80);
    expect(last).toBeGreaterThan(3 * first);
    expect(near(screenTimeAt(curve, 100), 30, 1e-12, 1e-12)).toBe(true);
  });

  it('should refuse a slowdown outside 1..8', () => {
    expect(() => slowDownNearEnd(10, 10, 9)).toThrow(RangeError);
  });
});

import { describe, expect, it } from 'vitest';
import { buildWorldline, distantObserverTime, sampleWorldline } from '@/lib/relativity';
import { expectRelative } from './support/tolerance';

describe('distantObserverTime', () => {
  it('should dilate a hovering camera\'s time by 1/sqrt(1 - 2M/r)', () => {
    // Hartle 2003 ch. 9 (static observers): dt/dtau = 1/sqrt(1 - 2M/r).
    for (const r of [2.5, 3, 10, 1000]) {
      const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'hover', r, duration: 40 }] });
      expectRelative(distantObserverTime(w, 25)!, 25 / Math.sqrt(1 - 2 / r), 1e-12, `hover at r = ${r}`);
    }
  });

  it('should dilate a circular orbit\'s time by 1/sqrt(1 - 3M/r)', () => {
    // Bardeen, Press & Teukolsky 1972: u^t = 1/sqrt(1 - 3M/r) on a circular geodesic.
    for (const r of [4, 6, 20]) {
      const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'circular-orbit', r, duration: 100 }] });
      expectRelative(distantObserverTime(w, 70)!, 70 / Math.sqrt(1 - 3 / r), 1e-12, `orbit at r = ${r}`);
    }
  });

  it('should follow the cycloid of a drop from rest, growing without bound at the horizon and undefined inside', () => {
    // MTW 1973 eq. 31.10 (radial drop from rest at R, M = 1), value from memory, checked here against the
    // proper time and radius of the same cycloid (eq. 25.28): r = (R/2)(1 + cos eta),
    // tau = (R/2) sqrt(R/2) (eta + sin eta), t = 2 ln|(q + tan(eta/2)) / (q - tan(eta/2))| + 2 q (eta + (R/4)(eta + sin eta)), q = sqrt(R/2 - 1).
    const R = 12;
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'drop', r: R }] });
    const q = Math.sqrt(R / 2 - 1);
    for (const eta of [0.3, 1.2, 2.0, 2.2]) {
      const tau = (R / 2) * Math.sqrt(R / 2) * (eta + Math.sin(eta));
      const r = (R / 2) * (1 + Math.cos(eta));
      expectRelative(sampleWorldline(w, tau).state.r, r, 1e-10, `cycloid radius at eta = ${eta}`);
      const tan = Math.tan(eta / 2);
      const t = 2 * Math.log(Math.abs((q + tan) / (q - tan))) + 2 * q * (eta + (R / 4) * (eta + Math.sin(eta)));
      expectRelative(distantObserverTime(w, tau)!, t, 1e-8, `t at eta = ${eta} (r = ${r.toFixed(3)})`);
    }
    // the horizon is where tan(eta/2) = q: t diverges logarithmically just outside it
    const etaH = 2 * Math.atan(q);
    const near = (e: number) => distantObserverTime(w, (R / 2) * Math.sqrt(R / 2) * (e + Math.sin(e)))!;
    expect(near(etaH - 1e-6)).toBeGreaterThan(near(etaH - 1e-3) + 2 * Math.log(1e3) * 0.9);
    expect(distantObserverTime(w, (R / 2) * Math.sqrt(R / 2) * (etaH + 0.01 + Math.sin(etaH + 0.01)))).toBeNull();
  });

  it('should refuse a proper time outside the path', () => {
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'hover', r: 5, duration: 10 }] });
    expect(() => distantObserverTime(w, 11)).toThrow(RangeError);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { observeRay } from '@/lib/relativity';
import { odexTraceRay } from './support/odexPhotonTracer';

const B_CRIT = 3 * Math.sqrt(3);

describe('observeRay', () => {
  it('should agree with an odex integration of the geodesic equation for hundreds of random rays', () => {
    // Independent reference: odex (Hairer & Wanner's GBS extrapolation, npm registry) at tolerance 1e-12,
    // integrating d^2u/dphi^2 = -u + 3u^2 in the azimuth (no Schwarzschild t, so r < 2 is fine).
    let worst = 0;
    let checked = 0;
    fc.assert(
      fc.property(
        fc.double({ min: Math.log(0.05), max: Math.log(300), noNaN: true }),
        fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.boolean(),
        (logR, psi, energyMix, hover) => {
          const r = Math.exp(logR);
          const f = 1 - 2 / r;
          const isStatic = hover && r > 2.02;
          const eps = isStatic ? Math.sqrt(f) : Math.sqrt(Math.max(f, 0)) + 2 * energyMix;
          const ur = isStatic ? 0 : -Math.sqrt(Math.max(eps * eps - f, 0));
          const energy = eps - Math.cos(psi) * ur;
          const b = Math.abs((r * Math.sin(psi)) / energy);
          const nearEdge = Math.abs(b / B_CRIT - 1);
          fc.pre(nearEdge > 1e-7 && Math.abs(energy) > 1e-6 && Math.abs(r - 2) > 1e-6);
          const exact = observeRay(r, psi, isStatic ? { kind: 'static' } : { kind: 'radial', energy: eps });
          const reference = odexTraceRay(r, psi, eps, ur, 1e-12);
          expect(exact.fate, `fate r=${r} psi=${psi} eps=${eps}`).toBe(reference.fate);
          const tolerance = 1e-8 + 1e-12 / nearEdge;
          const error = Math.abs(exact.phi - reference.phi);
          worst = Math.max(worst, error);
          checked++;
          expect(error, `phi r=${r} psi=${psi} eps=${eps}`).toBeLessThan(tolerance);
        },
      ),
      { seed: 20250611, numRuns: 400 },
    );
    console.log(`observeRay vs odex: ${checked} rays, worst |dphi| = ${worst.toExponential(2)} rad`);
    expect(checked).toBeGreaterThan(300);
  });
});

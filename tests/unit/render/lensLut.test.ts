import { describe, expect, it } from 'vitest';
import { RayTable, createRayLookup } from '@/lib/relativity';
import { buildLensLut, lookupLensLut } from '@/lib/render/lensLut';
import { GeodesicRayTracer } from '@/lib/render/bruteForce';
import { close } from './helpers';

describe('lookupLensLut', () => {
  it('should give phi and dphi/dpsi of an odex integration at and around psi = pi/2 for a hovering camera, where k^r = 0', () => {
    // psi = pi/2 is the camera's own turning point (k^r = 0, physics.md section 5): phi is smooth there, but a
    // pixel looking exactly sideways must not get a NaN or a wrong slope (a wrong slope mis-sizes star kernels and
    // broke the star flux F g^4 J by 16% along such a column). Reference: GeodesicRayTracer (odex, npm registry).
    const r = 10;
    const eps = Math.sqrt(1 - 2 / r);
    const lut = buildLensLut(RayTable.build(r, eps, 0), eps, 0);
    const reference = new GeodesicRayTracer(r, eps, 0, 1e-13);
    const got = createRayLookup();
    const want = createRayLookup();
    for (const offset of [-1e-4, -1e-6, -1e-9, 0, 1e-12, 1e-9, 1e-6, 1e-4]) {
      const psi = Math.PI / 2 + offset;
      lookupLensLut(lut, psi, Math.cos(psi), got);
      reference.trace(psi, Math.cos(psi), want);
      expect(got.fate).toBe(want.fate);
      expect(close(got.phi, want.phi, 1e-7)).toBe(true);
      expect(close(got.dPhiDPsi, want.dPhiDPsi, 1e-5)).toBe(true);
    }
  });
});

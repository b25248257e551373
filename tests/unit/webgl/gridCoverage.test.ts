import { describe, expect, it } from 'vitest';
import { lensedGridCoverage } from '@/lib/webgl/gridCoverage';
import { drawLensedGrid, createGridPoint } from '@/lib/render/grids';
import { expectClose } from './close';

const DEG = Math.PI / 180;

/** Grid point at (lat, lon) with isotropic screen derivatives of `pxRad` radians per pixel. */
function point(latDeg: number, lonDeg: number, pxRad: number): Float64Array {
  const la = latDeg * DEG;
  const lo = lonDeg * DEG;
  const d = [Math.cos(la) * Math.cos(lo), Math.cos(la) * Math.sin(lo), Math.sin(la)];
  const east = [-Math.sin(lo), Math.cos(lo), 0];
  const north = [-Math.sin(la) * Math.cos(lo), -Math.sin(la) * Math.sin(lo), Math.cos(la)];
  return new Float64Array([...d, ...east.map((v) => v * pxRad), ...north.map((v) => v * pxRad)]);
}

describe('lensedGridCoverage', () => {
  it('should cover a pixel centred on a one-pixel line fully and one two pixels away not at all (box filter, common practice)', () => {
    const px = 1e-3;
    expectClose(lensedGridCoverage(point(30, 7, px), 15, 1, 1), 1, 1e-9);
    expectClose(lensedGridCoverage(point(30 + (2 * px) / DEG, 7, px), 15, 1, 1), 0, 1e-9);
    // half a pixel off the line: half covered
    expectClose(lensedGridCoverage(point(30 + (0.5 * px) / DEG, 7, px), 15, 1, 1), 0.5, 1e-6);
  });

  it('should match lib/render drawLensedGrid for solid lines (the renderer it mirrors)', () => {
    const ref = createGridPoint();
    for (const [lat, lon, px] of [[12.3, 44.1, 2e-3], [-59.9, -120.02, 5e-4], [44.99, 3, 1e-2], [0.01, 179.99, 3e-3]]) {
      const p = point(lat, lon, px);
      ref.set(p);
      const returned = drawLensedGrid(ref, 15, 1.5, 0.5, false) as unknown;
      const expected = typeof returned === 'number' ? returned : ref[9];
      expectClose(lensedGridCoverage(p, 15, 1.5, 0.5), expected, 1e-9, `${lat}, ${lon}`);
    }
  });

  it('should reject a spacing outside 1..90 degrees', () => {
    expect(() => lensedGridCoverage(point(0, 0, 1e-3), 0.5, 1, 1)).toThrow(RangeError);
  });
});

import { describe, expect, it } from 'vitest';
import { createProjector } from '@/lib/render/projections';
import type { Projection } from '@/lib/render/schema';
import { createSolidAngleScratch, pixelSolidAngleSr } from '@/lib/safety/solidAngle';
import { buildWorkingGrid } from '@/lib/safety/workingGrid';
import { closeRel } from './helpers';

const DEG = Math.PI / 180;

function totalSolidAngle(projection: Projection, width: number, height: number, maxCellDeg = 0.25): number {
  const grid = buildWorkingGrid(createProjector(projection, width, height), width, height, maxCellDeg);
  let sum = 0;
  for (let c = 0; c < grid.cellCount; c++) sum += grid.cellSolidAngleSr[c];
  return sum;
}

describe('buildWorkingGrid', () => {
  it('should sum a 180-degree dome master to a hemisphere, 2 pi sr, within 0.5%', () => {
    // solid angle of a hemisphere = 2 pi sr (textbook geometry)
    const total = totalSolidAngle({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, 512, 512);
    console.log('dome 180 relative error', total / (2 * Math.PI) - 1);
    expect(closeRel(total, 2 * Math.PI, 0.005)).toBe(true);
  });

  it('should sum a 230-degree dome master to 2 pi (1 - cos 115 deg)', () => {
    // spherical cap of half-angle t: 2 pi (1 - cos t) (textbook geometry)
    const total = totalSolidAngle({ kind: 'dome', apertureDeg: 230, tiltDeg: 0 }, 512, 512);
    const expected = 2 * Math.PI * (1 - Math.cos(115 * DEG));
    console.log('dome 230 relative error', total / expected - 1);
    expect(closeRel(total, expected, 0.005)).toBe(true);
  });

  it('should sum a 90-degree flat frame to the pyramid solid angle 4 arcsin(sin a sin b)', () => {
    // rectangular pyramid with half-angles a, b: 4 arcsin(sin a sin b) (standard result, common practice)
    const w = 400, h = 300;
    const a = 45 * DEG;
    const b = Math.atan(Math.tan(a) * (h / w));
    const expected = 4 * Math.asin(Math.sin(a) * Math.sin(b));
    const total = totalSolidAngle({ kind: 'flat', fovDeg: 90 }, w, h);
    console.log('flat 90 relative error', total / expected - 1);
    expect(closeRel(total, expected, 1e-4)).toBe(true);
  });

  it('should sum an equirectangular frame to 4 pi and a cube face to 4 pi / 6', () => {
    // whole sphere 4 pi sr; the six faces of a cube seen from its centre share it equally (symmetry)
    expect(closeRel(totalSolidAngle({ kind: 'equirect' }, 512, 256), 4 * Math.PI, 1e-3)).toBe(true);
    expect(closeRel(totalSolidAngle({ kind: 'cubeFace', face: 'up' }, 256, 256), (4 * Math.PI) / 6, 1e-4)).toBe(true);
  });

  it('should cut a large frame into cells under maxCellDeg and keep its total solid angle', () => {
    // cells are sums of pixel solid angles, so blocking changes no total (invariant); cap 2 pi (1 - cos 100 deg)
    const grid = buildWorkingGrid(createProjector({ kind: 'dome', apertureDeg: 200, tiltDeg: 0 }, 1024, 1024), 1024, 1024, 0.8);
    expect(grid.blockPx).toBe(4); // 200 deg / 1024 px = 0.195 deg per pixel; 4 x 0.195 = 0.78 <= 0.8 < 5 x 0.195
    let total = 0;
    for (let c = 0; c < grid.cellCount; c++) total += grid.cellSolidAngleSr[c];
    expect(closeRel(total, 2 * Math.PI * (1 - Math.cos(100 * DEG)), 0.005)).toBe(true);
  });
});

describe('pixelSolidAngleSr', () => {
  it('should give (1 / f)^2 for the centre pixel of a flat frame', () => {
    // pinhole camera: a pixel on the axis subtends (pixel / focal length)^2 sr (small-angle, textbook optics)
    const w = 1000;
    const f = w / 2 / Math.tan(30 * DEG);
    const p = createProjector({ kind: 'flat', fovDeg: 60 }, w, w);
    const omega = pixelSolidAngleSr(p, 500, 500, createSolidAngleScratch());
    expect(closeRel(omega, 1 / (f * f), 1e-6)).toBe(true);
  });

  it('should shrink dome pixels by sin(theta) / theta away from the zenith', () => {
    // azimuthal equidistant projection: area element sin(theta) d theta d phi = (sin theta / theta) rho d rho d phi (textbook)
    const size = 1000;
    const radPerPx = (90 * DEG) / (size / 2);
    const p = createProjector({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, size, size);
    const s = createSolidAngleScratch();
    const theta = 60 * DEG;
    const px = size / 2 + theta / radPerPx;
    const omega = pixelSolidAngleSr(p, px, size / 2, s);
    expect(closeRel(omega, radPerPx * radPerPx * (Math.sin(theta) / theta), 1e-4)).toBe(true);
    expect(pixelSolidAngleSr(p, 0.5, 0.5, s)).toBe(0); // a corner outside the image circle
  });
});

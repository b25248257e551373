import { describe, expect, it } from 'vitest';
import { createGridPoint, drawGrid, drawLensedGrid } from '@/lib/render/grids';
import { close } from './helpers';

const DEG = Math.PI / 180;

/**
 * A grid point at (lat, lon) on the unit sphere whose screen derivatives move it by `latPerPx`
 * radians of latitude per pixel along one screen axis and `lonPerPx` radians of longitude per pixel
 * along the other (a view stretched differently in the two directions, as near the shadow rim).
 */
function point(lat: number, lon: number, latPerPx: number, lonPerPx: number): Float64Array {
  const p = createGridPoint();
  const c = Math.cos(lat);
  // [9] is drawLensedGrid's output
  p[0] = c * Math.cos(lon);
  p[1] = c * Math.sin(lon);
  p[2] = Math.sin(lat);
  // d/dlat = (-sin lat cos lon, -sin lat sin lon, cos lat); d/dlon = (-cos lat sin lon, cos lat cos lon, 0)
  p[3] = latPerPx * -Math.sin(lat) * Math.cos(lon);
  p[4] = latPerPx * -Math.sin(lat) * Math.sin(lon);
  p[5] = latPerPx * c;
  p[6] = lonPerPx * -c * Math.sin(lon);
  p[7] = lonPerPx * c * Math.cos(lon);
  p[8] = 0;
  return p;
}

/** drawLensedGrid's coverage (written into p[9]) for a 15-degree grid. */
function coverage(p: Float64Array, widthPx: number, filterPx: number, dashed: boolean): number {
  drawLensedGrid(p, 15, widthPx, filterPx, dashed);
  return p[9];
}

/** Coverage integrated across the parallel at latitude 0, in output pixels (screen step 0.01 px). */
function inkAcrossParallel(latPerPx: number, lonPerPx: number, widthPx: number, filterPx = 1): number {
  let ink = 0;
  for (let s = -6; s <= 6; s += 0.01) ink += 0.01 * coverage(point(s * latPerPx, 7.5 * DEG, latPerPx, lonPerPx), widthPx, filterPx, false);
  return ink;
}

describe('drawLensedGrid', () => {
  it('should draw a line exactly lineWidthPx wide across the screen even where the view is 200 times more stretched along the line', () => {
    // A box filter conserves area: the coverage integrated across a line equals its width (common practice in
    // antialiased rendering). The footprint along the line must not widen it: that was the thick-arc defect.
    for (const widthPx of [1, 2.5]) {
      const isotropic = inkAcrossParallel(1e-3, 1e-3, widthPx);
      const stretched = inkAcrossParallel(1e-3, 0.2, widthPx);
      console.log(`width ${widthPx} px: ink across the line ${isotropic.toFixed(4)} px (isotropic view), ${stretched.toFixed(4)} px (stretched 200x along it)`);
      expect(close(isotropic, widthPx, 0.02)).toBe(true);
      expect(close(stretched, widthPx, 0.02)).toBe(true);
    }
    // the same line with a half-pixel filter (2 x 2 supersampling) still integrates to its width
    expect(close(inkAcrossParallel(1e-3, 0.2, 1, 0.5), 1, 0.02)).toBe(true);
    // stretched 30 times along the line: the footprint-only drawGrid, fed the larger stretch, draws it about 30 px
    // wide (the thick-arc defect); drawLensedGrid keeps 1 px
    let legacy = 0;
    for (let s = -100; s <= 100; s += 0.05) legacy += 0.05 * drawGrid(point(s * 1e-3, 7.5 * DEG, 1e-3, 0.03), 0.03, 15, 1, false);
    console.log(`stretched 30x along the line: footprint-only ink ${legacy.toFixed(2)} px, derivative-based ${inkAcrossParallel(1e-3, 0.03, 1).toFixed(4)} px`);
    expect(legacy).toBeGreaterThan(20);
    expect(close(inkAcrossParallel(1e-3, 0.03, 1), 1, 0.02)).toBe(true);
  });

  it('should fade a family of lines out as their spacing on screen falls towards 2 pixels instead of filling the area', () => {
    // spacing 15 degrees = 0.2618 rad; latPerPx = spacing / (spacing in px)
    const spacing = 15 * DEG;
    const centreCover = (spacingPx: number) => coverage(point(0, 7.5 * DEG, spacing / spacingPx, 1e-3), 1, 1, false);
    expect(close(centreCover(2), 0, 1e-12)).toBe(true);
    expect(close(centreCover(1.2), 0, 1e-12)).toBe(true);
    expect(centreCover(3) > 0 && centreCover(3) < 1).toBe(true);
    expect(close(centreCover(4), 1, 1e-12)).toBe(true);
    expect(close(centreCover(50), 1, 1e-12)).toBe(true);
  });

  it('should give a dashed line half the ink of a solid one along its length', () => {
    // box-filtered square wave with a 50% duty cycle averages to 1/2 (common practice)
    let dashed = 0;
    let solid = 0;
    const steps = 20000;
    for (let i = 0; i < steps; i++) {
      const lon = (i / steps) * 60 * DEG;
      const p = point(0, lon, 1e-3, 2e-3);
      dashed += coverage(p, 1, 1, true);
      solid += coverage(p, 1, 1, false);
    }
    expect(solid).toBeGreaterThan(0);
    expect(close(dashed / solid, 0.5, 0.01)).toBe(true);
  });
});

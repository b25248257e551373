/**
 * Grid-line coverage through the lensing, measured on screen: the formula of
 * lib/render/grids.ts drawLensedGrid (its horizon grids) kept here as a
 * stable, returning function for the celestial grid of the "where the light
 * comes from" view, and the TypeScript twin of gridCoverage in
 * shaders/sky.common.glsl.
 */

const DEG = Math.PI / 180;

/** Box-filtered coverage of the nearest line of one family, faded where lines crowd on screen. */
function lineCoverage(offsetRad: number, ratePerPx: number, spacingRad: number, widthPx: number, filterPx: number): number {
  if (!(ratePerPx > 0) || !(ratePerPx < Infinity)) return 0;
  const crowd = 1 + widthPx;
  const fade = (spacingRad / ratePerPx - crowd) / crowd;
  if (fade <= 0) return 0;
  const distPx = offsetRad / ratePerPx;
  const half = 0.5 * widthPx;
  const hi = Math.min(distPx + 0.5 * filterPx, half);
  const lo = Math.max(distPx - 0.5 * filterPx, -half);
  const cover = hi > lo ? (hi - lo) / filterPx : 0;
  return fade >= 1 ? cover : cover * fade * fade * (3 - 2 * fade);
}

/**
 * Coverage of a latitude/longitude grid (solid lines) at a point of the sphere, line widths in output pixels.
 * @param p 9 floats: unit vector d (hole frame; latitude from the x-y plane, longitude from +x), then its
 *   change per output pixel along two orthogonal screen directions
 * @param spacingDeg line spacing, degrees (1..90)
 * @param lineWidthPx line width, output pixels (> 0)
 * @param filterPx width of the sample's box filter, output pixels (1 / supersampling, > 0)
 * @returns coverage 0..1
 * @throws RangeError for spacing, width or filter out of range
 */
export function lensedGridCoverage(p: ArrayLike<number>, spacingDeg: number, lineWidthPx: number, filterPx: number): number {
  if (!(spacingDeg >= 1 && spacingDeg <= 90)) throw new RangeError(`spacingDeg must be in 1..90 degrees; got ${spacingDeg}`);
  if (!(lineWidthPx > 0 && lineWidthPx < Infinity)) throw new RangeError(`lineWidthPx must be a finite number > 0; got ${lineWidthPx}`);
  if (!(filterPx > 0 && filterPx <= 1)) throw new RangeError(`filterPx must be in (0, 1] pixels; got ${filterPx}`);
  const spacing = spacingDeg * DEG;
  const dx = p[0];
  const dy = p[1];
  const dz = p[2];
  const cosLat = Math.max(Math.hypot(dx, dy), 1e-12);
  // atan2 rather than asin, as in the shader (software GPUs' asin is coarse)
  const lat = Math.atan2(dz, cosLat);
  const lon = Math.atan2(dy, dx);
  // d(lat) = t_z / cos(lat) and d(lon) = (d x t)_z / cos^2(lat) for a displacement t of the unit vector d
  const latRate = Math.hypot(p[5], p[8]) / cosLat;
  const lonRate = Math.hypot((dx * p[4] - dy * p[3]) / (cosLat * cosLat), (dx * p[7] - dy * p[6]) / (cosLat * cosLat));
  const parallel = lineCoverage(Math.abs(lat - Math.round(lat / spacing) * spacing), latRate, spacing, lineWidthPx, filterPx);
  const meridian = lineCoverage(Math.abs(lon - Math.round(lon / spacing) * spacing), lonRate, spacing, lineWidthPx, filterPx);
  return Math.max(parallel, meridian);
}

/**
 * Latitude/longitude grids painted where backward rays end on r = 2M
 * (physics.md section 5, last point), in the hole's fixed frame (J2000 axes:
 * latitude from the equatorial plane, longitude from the x axis).
 *
 * Lines keep their width in output pixels however strongly the view is
 * lensed: the distance from a sample to the nearest line is measured in
 * output pixels through the screen-space gradient of latitude (or longitude),
 * obtained from the derivative of the ray's end point with respect to the
 * pixel position (the lensing table's dphi/dpsi, not a neighbour difference).
 * Each line is box-filtered over the sample's footprint, and a family of lines
 * whose spacing on screen drops towards about two pixels (near the shadow
 * rim, where they crowd) fades out instead of filling the area.
 */

const DEG = Math.PI / 180;

/**
 * Screen-space derivative of a grid point: d and its rates of change per
 * output pixel along two orthogonal screen directions, all in the hole frame,
 * and the coverage drawLensedGrid computes for it.
 * Layout: [dx, dy, dz, ax, ay, az, bx, by, bz, coverage].
 */
export type GridPoint = Float64Array;

/** A fresh GridPoint record (10 floats). */
export function createGridPoint(): GridPoint {
  return new Float64Array(10);
}

/**
 * Coverage of a grid line at a point of the horizon sphere, with line widths and crowding
 * measured on screen through the point's derivatives (the renderer's horizon and far-side grids).
 * Allocation-free: the result is written into the record rather than returned (a returned
 * double would be boxed per pixel).
 * @param p unit direction of the point and its derivatives per output pixel (see GridPoint), hole
 *   frame; p[9] receives the coverage, 0..1
 * @param spacingDeg grid spacing, degrees (1..90)
 * @param lineWidthPx line width in output pixels (> 0)
 * @param filterPx width of the sample's box filter in output pixels (1 / supersampling), > 0
 * @param dashed true for dashes (on for half of every quarter spacing along the line)
 */
export function drawLensedGrid(p: GridPoint, spacingDeg: number, lineWidthPx: number, filterPx: number, dashed: boolean): void {
  if (!(spacingDeg >= 1 && spacingDeg <= 90)) throw new RangeError('spacingDeg: 1..90 degrees');
  if (!(lineWidthPx > 0 && lineWidthPx < Infinity)) throw new RangeError('lineWidthPx: finite, > 0 px');
  if (!(filterPx > 0 && filterPx <= 1)) throw new RangeError('filterPx: (0, 1] px');
  if (p.length < 10) throw new RangeError('p: a GridPoint of 10 floats');
  const spacing = spacingDeg * DEG;
  const dx = p[0];
  const dy = p[1];
  const dz = p[2];
  const rho = Math.sqrt(dx * dx + dy * dy);
  const cosLat = rho > 1e-12 ? rho : 1e-12;
  const lat = Math.asin(dz > 1 ? 1 : dz < -1 ? -1 : dz);
  const lon = Math.atan2(dy, dx);
  // d(lat) = t_z / cos(lat) and d(lon) = (d x t)_z / cos^2(lat) for a displacement t of the unit vector d
  const latRate = Math.sqrt(p[5] * p[5] + p[8] * p[8]) / cosLat;
  const lonA = (dx * p[4] - dy * p[3]) / (cosLat * cosLat);
  const lonB = (dx * p[7] - dy * p[6]) / (cosLat * cosLat);
  const lonRate = Math.sqrt(lonA * lonA + lonB * lonB);
  // full strength while the gap between lines is at least about one line width plus a pixel; gone at half that
  const crowd = 1 + lineWidthPx;
  const half = 0.5 * lineWidthPx;
  const dash = spacing / 4;
  let best = 0;
  // family 0: parallels (lines of constant latitude, dashed along longitude); family 1: meridians
  for (let family = 0; family < 2; family++) {
    const coord = family === 0 ? lat : lon;
    const rate = family === 0 ? latRate : lonRate;
    if (!(rate > 0) || !(rate < Infinity)) continue;
    const fade = (spacing / rate - crowd) / crowd;
    if (fade <= 0) continue;
    // box filter of width filterPx over a line of width lineWidthPx, distances in output pixels
    const distPx = Math.abs(coord - Math.round(coord / spacing) * spacing) / rate;
    const hi = Math.min(distPx + 0.5 * filterPx, half);
    const lo = Math.max(distPx - 0.5 * filterPx, -half);
    if (!(hi > lo)) continue;
    let cover = (hi - lo) / filterPx;
    if (fade < 1) cover *= fade * fade * (3 - 2 * fade);
    if (dashed) {
      // mean of the dash square wave (on for the first half of each period) over the filter, in periods
      const along = (family === 0 ? lon : lat) / dash;
      const reach = (0.5 * filterPx * (family === 0 ? lonRate : latRate)) / dash;
      if (reach >= 1) {
        cover *= 0.5;
      } else if (!(reach > 0)) {
        if (along - Math.floor(along) >= 0.5) cover = 0;
      } else {
        const a = along - reach;
        const b = along + reach;
        const wa = Math.floor(a);
        const wb = Math.floor(b);
        const onA = 0.5 * wa + Math.min(a - wa, 0.5);
        const onB = 0.5 * wb + Math.min(b - wb, 0.5);
        cover *= (onB - onA) / (2 * reach);
      }
    }
    if (cover > best) best = cover;
  }
  p[9] = best;
}

/**
 * Coverage of a grid line at a point of a sphere from an isotropic footprint (no derivatives):
 * kept for callers that only know the footprint's size (e.g. lib/webgl's celestial grid). It
 * cannot keep lines thin where the view is stretched in one direction only; the renderer's
 * horizon grids use drawLensedGrid.
 * @param d unit vector of the point, hole frame
 * @param footRad angular size of one pixel on the horizon sphere, radians (> 0)
 * @param spacingDeg grid spacing, degrees (1..90)
 * @param lineWidthPx line width in output pixels
 * @param dashed true for dashes (on for half of every quarter spacing along the line)
 * @returns coverage 0..1
 */
export function drawGrid(d: Float64Array, footRad: number, spacingDeg: number, lineWidthPx: number, dashed: boolean): number {
  if (!(footRad > 0)) return 0;
  const spacing = spacingDeg * DEG;
  // lines closer together than ~4 px turn into moire: fade them out instead
  const fade = clamp01(2 - (8 * footRad) / spacing);
  if (fade === 0) return 0;
  const lat = Math.asin(d[2] > 1 ? 1 : d[2] < -1 ? -1 : d[2]);
  const lon = Math.atan2(d[1], d[0]);
  const cosLat = Math.cos(lat);
  const half = 0.5 * lineWidthPx;
  // parallels: angular distance to the nearest multiple of the spacing in latitude
  const dLat = Math.abs(lat - Math.round(lat / spacing) * spacing) / footRad;
  let parallel = clamp01(half + 0.5 - dLat) * Math.min(1, half * 2);
  // meridians: distance along the parallel circle; stop them short of the poles where they crowd
  const dLon = (Math.abs(lon - Math.round(lon / spacing) * spacing) * cosLat) / footRad;
  let meridian = Math.abs(lat) < Math.PI / 2 - spacing * 0.5 ? clamp01(half + 0.5 - dLon) * Math.min(1, half * 2) : 0;
  if (dashed) {
    const dash = spacing / 4;
    if (frac(lon / dash) >= 0.5) parallel = 0;
    if (frac(lat / dash) >= 0.5) meridian = 0;
  }
  return fade * Math.max(parallel, meridian);
}

function clamp01(x: number): number {
  return x <= 0 ? 0 : x >= 1 ? 1 : x;
}

function frac(x: number): number {
  return x - Math.floor(x);
}

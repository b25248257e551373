/**
 * Latitude/longitude grids painted where backward rays end on r = 2M
 * (physics.md section 5, last point), in the hole's fixed frame (J2000 axes:
 * latitude from the equatorial plane, longitude from the x axis). Lines are
 * box-filtered over the pixel's footprint on the horizon sphere, so they stay
 * about lineWidthPx wide however strongly the view is lensed.
 */

const DEG = Math.PI / 180;

/**
 * Coverage of a grid line at a point of the horizon sphere.
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

/**
 * Diffuse Milky Way: the brightness contours that the npm package d3-celestial
 * ships (data/mw.json: five nested outline levels "ol1".."ol5" as GeoJSON
 * MultiPolygons in [RA wrapped to -180..180, Dec] degrees, J2000; copyright
 * Olaf Frohn, BSD-3-Clause) rasterised into an equirectangular map from the
 * number of outline levels a direction lies in, then blurred to a smooth glow.
 *
 * Map layout (shared by every sky map in lib/render): column u covers RA from
 * 0 at the left edge increasing to 360 degrees at the right; row v covers Dec
 * from +90 at the top to -90 at the bottom.
 */

/**
 * Surface brightness inside all five outline levels, in mag-0 star fluxes per
 * steradian: the brightest Milky Way star clouds are about 20.5 mag per square
 * arcsecond, roughly 270 mag-0 fluxes per steradian (value from memory).
 */
export const MILKY_WAY_PEAK_BRIGHTNESS_PER_SR = 270;
/**
 * Brightness ratio between successive outline levels: contours of surface
 * brightness are spaced in magnitudes, so each level inward is taken as 0.75 mag
 * (a factor 2) brighter (common practice for isophote maps, no single source).
 */
export const MILKY_WAY_LEVEL_RATIO = 2;
/** Colour temperature of the Milky Way's integrated light, K (value from memory: yellowish disc light). */
export const MILKY_WAY_TEMPERATURE_K = 5000;

interface Geometry {
  type?: string;
  coordinates?: unknown;
}

/** Collect every ring of a Polygon or MultiPolygon as flat [lon0, lat0, lon1, lat1, ...] arrays. */
function ringsOf(geometry: Geometry): number[][] {
  const rings: number[][] = [];
  const polys =
    geometry.type === 'MultiPolygon'
      ? (geometry.coordinates as number[][][][])
      : geometry.type === 'Polygon'
        ? [geometry.coordinates as number[][][]]
        : [];
  for (const poly of polys) for (const ring of poly) rings.push(ring.flat());
  return rings;
}

/**
 * Rasterise one set of rings into a 0/1 coverage map by the even-odd rule along
 * each meridian, counting crossings up from the south celestial pole (outside
 * every outline). Segments are taken the short way round in RA, so rings that
 * cross RA 180 degrees (or circle the whole sky, like the band's edges) work.
 */
function rasteriseRings(rings: number[][], width: number, height: number, out: Float32Array, weight: number): void {
  const crossings: number[][] = Array.from({ length: width }, () => []);
  for (const ring of rings) {
    const n = ring.length / 2;
    for (let i = 0; i < n; i++) {
      const lon0 = ring[2 * i];
      const lat0 = ring[2 * i + 1];
      const j = (i + 1) % n;
      let dLon = ring[2 * j] - lon0;
      const lat1 = ring[2 * j + 1];
      if (dLon > 180) dLon -= 360;
      if (dLon < -180) dLon += 360;
      if (dLon === 0) continue;
      const a = Math.min(lon0, lon0 + dLon);
      const b = Math.max(lon0, lon0 + dLon);
      // columns whose centre RA lies in [a, b), in any turn of the circle
      const first = Math.ceil(((a + 360) / 360) * width - 0.5);
      const last = Math.ceil(((b + 360) / 360) * width - 0.5) - 1;
      for (let c = first; c <= last; c++) {
        const lonC = ((c + 0.5) / width) * 360 - 360;
        const t = (lonC - lon0) / dLon;
        const lat = lat0 + t * (lat1 - lat0);
        crossings[((c % width) + width) % width].push(lat);
      }
    }
  }
  for (let c = 0; c < width; c++) {
    const list = crossings[c].sort((p, q) => p - q);
    for (let k = 0; k + 1 < list.length; k += 2) {
      const south = list[k];
      const north = list[k + 1];
      // rows whose centre Dec lies in [south, north)
      const rowTop = Math.ceil(((90 - north) / 180) * height - 0.5);
      const rowBottom = Math.ceil(((90 - south) / 180) * height - 0.5) - 1;
      for (let r = Math.max(0, rowTop); r <= Math.min(height - 1, rowBottom); r++) out[r * width + c] += weight;
    }
  }
}

/** Separable Gaussian blur with wrap in RA (columns) and clamp in Dec (rows); sigma in texels. */
function blurEquirect(map: Float32Array, width: number, height: number, sigmaTexels: number): Float32Array {
  const radius = Math.ceil(3 * sigmaTexels);
  const kernel = new Float64Array(2 * radius + 1);
  let sum = 0;
  for (let k = -radius; k <= radius; k++) sum += kernel[k + radius] = Math.exp(-(k * k) / (2 * sigmaTexels * sigmaTexels));
  for (let k = 0; k < kernel.length; k++) kernel[k] /= sum;
  const tmp = new Float32Array(map.length);
  for (let r = 0; r < height; r++) {
    // widen the RA kernel towards the poles so the blur stays about round on the sky
    const stretch = Math.min(8, 1 / Math.max(1e-3, Math.cos(((r + 0.5) / height - 0.5) * Math.PI)));
    const rad = Math.min(width >> 1, Math.ceil(radius * stretch));
    let norm = 0;
    for (let k = -rad; k <= rad; k++) norm += Math.exp(-(k * k) / (2 * (sigmaTexels * stretch) ** 2));
    for (let c = 0; c < width; c++) {
      let acc = 0;
      for (let k = -rad; k <= rad; k++) {
        const cc = (c + k + width) % width;
        acc += map[r * width + cc] * Math.exp(-(k * k) / (2 * (sigmaTexels * stretch) ** 2));
      }
      tmp[r * width + c] = acc / norm;
    }
  }
  const out = new Float32Array(map.length);
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      let acc = 0;
      for (let k = -radius; k <= radius; k++) {
        const rr = Math.min(height - 1, Math.max(0, r + k));
        acc += tmp[rr * width + c] * kernel[k + radius];
      }
      out[r * width + c] = acc;
    }
  }
  return out;
}

/**
 * Rasterise d3-celestial's Milky Way outlines into an equirectangular brightness map.
 * @param geojson parsed content of d3-celestial data/mw.json (features with ids ol1..ol5)
 * @param width map width in texels (RA), 64..8192, even
 * @param height map height in texels (Dec), 32..4096
 * @param blurDeg Gaussian blur sigma in degrees of declination (0..10), softening the contour steps
 * @returns surface brightness in mag-0 star fluxes per steradian, row-major from Dec +90, RA 0
 * @throws RangeError for bad sizes or input that is not a FeatureCollection
 */
export function rasteriseMilkyWay(geojson: unknown, width = 1024, height = 512, blurDeg = 1.2): Float32Array {
  if (!Number.isInteger(width) || width < 64 || width > 8192) throw new RangeError('width: integer 64..8192 texels');
  if (!Number.isInteger(height) || height < 32 || height > 4096) throw new RangeError('height: integer 32..4096 texels');
  if (!Number.isFinite(blurDeg) || blurDeg < 0 || blurDeg > 10) throw new RangeError('blurDeg: 0..10 degrees');
  const features = (geojson as { features?: { geometry?: Geometry }[] })?.features;
  if (!Array.isArray(features)) throw new RangeError('geojson: must be a GeoJSON FeatureCollection of outlines');
  const map = new Float32Array(width * height);
  for (const f of features) {
    if (f.geometry) rasteriseRings(ringsOf(f.geometry), width, height, map, 1);
  }
  const levels = features.length;
  for (let i = 0; i < map.length; i++) {
    map[i] = map[i] > 0 ? MILKY_WAY_PEAK_BRIGHTNESS_PER_SR * Math.pow(MILKY_WAY_LEVEL_RATIO, map[i] - levels) : 0;
  }
  return blurDeg > 0 ? blurEquirect(map, width, height, (blurDeg / 180) * height) : map;
}

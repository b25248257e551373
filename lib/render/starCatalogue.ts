/**
 * Compact star catalogue: the Hipparcos-based star list that the npm package
 * d3-celestial ships (data/stars.8.json, about 41,000 stars to magnitude 8 with
 * B-V; copyright Olaf Frohn, BSD-3-Clause licence), turned into typed arrays
 * and a small binary form (magic "SKYSTAR1").
 *
 * d3-celestial stores each star as GeoJSON Point [lon, lat] in degrees, with
 * lon = right ascension wrapped into -180..180 (RA 213.9 deg is stored as
 * -146.1), lat = declination, J2000.
 */

/** A star list in typed arrays; index i is one star. */
export interface StarCatalogue {
  count: number;
  /** Hipparcos number (the GeoJSON feature id). */
  hip: Int32Array;
  /** J2000 right ascension, degrees 0..360. */
  raDeg: Float32Array;
  /** J2000 declination, degrees. */
  decDeg: Float32Array;
  /** Visual magnitude. */
  mag: Float32Array;
  /** B-V colour index, NaN where the source has none. */
  bv: Float32Array;
}

const MAGIC = 'SKYSTAR1';
const HEADER_BYTES = 16; // 8 magic + 4 count + 4 reserved

interface StarFeature {
  id?: number | string;
  properties?: { mag?: number | string; bv?: number | string };
  geometry?: { type?: string; coordinates?: number[] };
}

/**
 * Convert d3-celestial's stars GeoJSON into a catalogue.
 * @param geojson parsed content of d3-celestial data/stars.N.json
 * @returns catalogue with RA in 0..360 degrees; stars without a finite magnitude or position are skipped
 * @throws RangeError if the input is not a FeatureCollection
 */
export function catalogueFromGeoJson(geojson: unknown): StarCatalogue {
  const features = (geojson as { type?: string; features?: StarFeature[] })?.features;
  if (!Array.isArray(features)) throw new RangeError('geojson: must be a GeoJSON FeatureCollection of star points');
  const keep: StarFeature[] = [];
  for (const f of features) {
    const c = f.geometry?.coordinates;
    const mag = Number(f.properties?.mag);
    if (c && Number.isFinite(c[0]) && Number.isFinite(c[1]) && Number.isFinite(mag)) keep.push(f);
  }
  const cat = allocateCatalogue(keep.length);
  keep.forEach((f, i) => {
    const [lon, lat] = f.geometry!.coordinates!;
    cat.hip[i] = Number(f.id) | 0;
    cat.raDeg[i] = lon < 0 ? lon + 360 : lon;
    cat.decDeg[i] = lat;
    cat.mag[i] = Number(f.properties!.mag);
    const bvText = f.properties!.bv;
    const bv = bvText === '' || bvText === undefined ? NaN : Number(bvText);
    cat.bv[i] = Number.isFinite(bv) ? bv : NaN;
  });
  return cat;
}

/**
 * An empty catalogue of `count` stars (all fields zero), to be filled.
 * @param count number of stars (integer >= 0)
 */
export function allocateCatalogue(count: number): StarCatalogue {
  if (!Number.isInteger(count) || count < 0) throw new RangeError('count: an integer >= 0');
  return {
    count,
    hip: new Int32Array(count),
    raDeg: new Float32Array(count),
    decDeg: new Float32Array(count),
    mag: new Float32Array(count),
    bv: new Float32Array(count),
  };
}

/**
 * Serialise a catalogue to its binary form (little-endian; 20 bytes per star).
 * @param cat catalogue
 * @returns bytes: header then the hip, ra, dec, mag, bv arrays one after another
 */
export function encodeCatalogue(cat: StarCatalogue): Uint8Array {
  const n = cat.count;
  const bytes = new Uint8Array(HEADER_BYTES + n * 20);
  for (let i = 0; i < MAGIC.length; i++) bytes[i] = MAGIC.charCodeAt(i);
  const view = new DataView(bytes.buffer);
  view.setUint32(8, n, true);
  let off = HEADER_BYTES;
  for (let i = 0; i < n; i++, off += 4) view.setInt32(off, cat.hip[i], true);
  for (const arr of [cat.raDeg, cat.decDeg, cat.mag, cat.bv]) {
    for (let i = 0; i < n; i++, off += 4) view.setFloat32(off, arr[i], true);
  }
  return bytes;
}

/**
 * Read a catalogue from its binary form.
 * @param bytes output of encodeCatalogue
 * @returns catalogue
 * @throws RangeError if the magic or length is wrong
 */
export function decodeCatalogue(bytes: Uint8Array): StarCatalogue {
  if (bytes.length < HEADER_BYTES) throw new RangeError('bytes: too short for a star catalogue');
  for (let i = 0; i < MAGIC.length; i++) {
    if (bytes[i] !== MAGIC.charCodeAt(i)) throw new RangeError('bytes: not a SKYSTAR1 star catalogue');
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const n = view.getUint32(8, true);
  if (bytes.length !== HEADER_BYTES + n * 20) throw new RangeError('bytes: length does not match the star count');
  const cat = allocateCatalogue(n);
  let off = HEADER_BYTES;
  for (let i = 0; i < n; i++, off += 4) cat.hip[i] = view.getInt32(off, true);
  for (const arr of [cat.raDeg, cat.decDeg, cat.mag, cat.bv]) {
    for (let i = 0; i < n; i++, off += 4) arr[i] = view.getFloat32(off, true);
  }
  return cat;
}

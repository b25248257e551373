/**
 * Binary form of the Milky Way brightness map sent to browsers (the star
 * catalogue travels in lib/render's SKYSTAR1 form): magic "SKYMWMP1", width
 * and height (uint32 little-endian), then width x height float32 values in
 * mag-0 star fluxes per steradian, row-major from Dec +90 and RA 0.
 */

const MAGIC = 'SKYMWMP1';
const HEADER_BYTES = 16;

/** A Milky Way brightness map (lib/render milkyWay.ts layout). */
export interface BrightnessMap {
  width: number;
  height: number;
  data: Float32Array;
}

/**
 * Encode a brightness map.
 * @param map width x height floats
 * @returns bytes
 * @throws RangeError if sizes and data disagree
 */
export function encodeBrightnessMap(map: BrightnessMap): Uint8Array {
  if (!Number.isInteger(map.width) || !Number.isInteger(map.height) || map.width < 1 || map.height < 1 || map.data.length !== map.width * map.height) {
    throw new RangeError('map: positive integer width and height with width x height values');
  }
  const bytes = new Uint8Array(HEADER_BYTES + 4 * map.data.length);
  for (let i = 0; i < MAGIC.length; i++) bytes[i] = MAGIC.charCodeAt(i);
  const view = new DataView(bytes.buffer);
  view.setUint32(8, map.width, true);
  view.setUint32(12, map.height, true);
  for (let i = 0; i < map.data.length; i++) view.setFloat32(HEADER_BYTES + 4 * i, map.data[i], true);
  return bytes;
}

/**
 * Decode a brightness map.
 * @param bytes output of encodeBrightnessMap
 * @returns the map
 * @throws RangeError if the magic or length is wrong
 */
export function decodeBrightnessMap(bytes: Uint8Array): BrightnessMap {
  if (bytes.length < HEADER_BYTES) throw new RangeError('bytes: too short for a Milky Way map');
  for (let i = 0; i < MAGIC.length; i++) if (bytes[i] !== MAGIC.charCodeAt(i)) throw new RangeError('bytes: not a SKYMWMP1 map');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const width = view.getUint32(8, true);
  const height = view.getUint32(12, true);
  if (bytes.length !== HEADER_BYTES + 4 * width * height) throw new RangeError('bytes: length does not match width x height');
  const data = new Float32Array(width * height);
  for (let i = 0; i < data.length; i++) data[i] = view.getFloat32(HEADER_BYTES + 4 * i, true);
  return { width, height, data };
}

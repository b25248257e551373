/**
 * Mipmapped equirectangular sky maps (layout as in milkyWay.ts: RA 0..360
 * degrees left to right, Dec +90..-90 top to bottom), sampled trilinearly at a
 * level chosen from each pixel's footprint on the sky, so that demagnified
 * regions near the shadow average the sky instead of sparkling (mipmapping:
 * Williams 1983, "Pyramidal parametrics", SIGGRAPH).
 */

/** One level of the pyramid: row-major texels, `channels` floats each. */
interface MipLevel {
  width: number;
  height: number;
  data: Float32Array;
}

/** An equirectangular map with its mip pyramid. */
export interface SkyMipMap {
  channels: number;
  levels: MipLevel[];
  /** Angular height of one texel of level 0, radians (pi / height). */
  texelRad: number;
}

/**
 * Build the mip pyramid of an equirectangular map by 2x2 box averaging.
 * @param data level-0 texels, row-major, `channels` floats per texel
 * @param width level-0 width (texels, RA), >= 2
 * @param height level-0 height (texels, Dec), >= 1
 * @param channels floats per texel, 1..4
 * @returns the pyramid down to a single row
 * @throws RangeError if sizes and data length disagree
 */
export function buildSkyMipMap(data: Float32Array, width: number, height: number, channels: number): SkyMipMap {
  if (!Number.isInteger(channels) || channels < 1 || channels > 4) throw new RangeError('channels: integer 1..4');
  if (!Number.isInteger(width) || width < 2) throw new RangeError('width: integer >= 2 texels');
  if (!Number.isInteger(height) || height < 1) throw new RangeError('height: integer >= 1 texels');
  if (data.length !== width * height * channels) throw new RangeError('data: length must be width * height * channels');
  const levels: MipLevel[] = [{ width, height, data }];
  let cur = levels[0];
  while (cur.height > 1 && cur.width > 1) {
    const w = Math.max(1, cur.width >> 1);
    const h = Math.max(1, cur.height >> 1);
    const next = new Float32Array(w * h * channels);
    for (let r = 0; r < h; r++) {
      const r0 = Math.min(cur.height - 1, 2 * r);
      const r1 = Math.min(cur.height - 1, 2 * r + 1);
      for (let c = 0; c < w; c++) {
        const c0 = Math.min(cur.width - 1, 2 * c);
        const c1 = Math.min(cur.width - 1, 2 * c + 1);
        for (let k = 0; k < channels; k++) {
          next[(r * w + c) * channels + k] =
            0.25 *
            (cur.data[(r0 * cur.width + c0) * channels + k] +
              cur.data[(r0 * cur.width + c1) * channels + k] +
              cur.data[(r1 * cur.width + c0) * channels + k] +
              cur.data[(r1 * cur.width + c1) * channels + k]);
        }
      }
    }
    cur = { width: w, height: h, data: next };
    levels.push(cur);
  }
  return { channels, levels, texelRad: Math.PI / height };
}

/**
 * Bilinear sample of one level, wrapping in u; adds weight * value into out.
 * Arguments travel in io ([0] u in [0, 1), [1] v in [0, 1], [3] weight) so no number is boxed per call.
 */
function addBilinear(level: MipLevel, channels: number, io: Float64Array, out: Float64Array): void {
  const w = level.width;
  const h = level.height;
  const weight = io[3];
  const x = io[0] * w - 0.5;
  let y = io[1] * h - 0.5;
  if (y < 0) y = 0;
  if (y > h - 1) y = h - 1;
  // u is in [0, 1), so x is in [-0.5, w - 0.5): the left neighbour wraps only from -1 to w - 1
  const x0f = Math.floor(x);
  const y0 = Math.floor(y);
  const fx = x - x0f;
  const fy = y - y0;
  const x0 = x0f < 0 ? w - 1 : x0f;
  const x1 = x0 + 1 >= w ? 0 : x0 + 1;
  const y1 = y0 + 1 < h ? y0 + 1 : y0;
  const d = level.data;
  const w00 = (1 - fx) * (1 - fy) * weight;
  const w10 = fx * (1 - fy) * weight;
  const w01 = (1 - fx) * fy * weight;
  const w11 = fx * fy * weight;
  const i00 = (y0 * w + x0) * channels;
  const i10 = (y0 * w + x1) * channels;
  const i01 = (y1 * w + x0) * channels;
  const i11 = (y1 * w + x1) * channels;
  if (channels === 3) {
    out[0] += w00 * d[i00] + w10 * d[i10] + w01 * d[i01] + w11 * d[i11];
    out[1] += w00 * d[i00 + 1] + w10 * d[i10 + 1] + w01 * d[i01 + 1] + w11 * d[i11 + 1];
    out[2] += w00 * d[i00 + 2] + w10 * d[i10 + 2] + w01 * d[i01 + 2] + w11 * d[i11 + 2];
    return;
  }
  for (let k = 0; k < channels; k++) out[k] += w00 * d[i00 + k] + w10 * d[i10 + k] + w01 * d[i01 + k] + w11 * d[i11 + k];
}

/** Scratch of the sampleSkyMap wrapper (one per module instance, i.e. per thread). */
const wrapIo = new Float64Array(4);

/**
 * Trilinear sample of a sky map in a direction with a given footprint.
 * @param map the pyramid
 * @param u RA / 360 degrees, any real (wraps)
 * @param v (90 - Dec) / 180 degrees, 0..1
 * @param footprintRad angular size of the region to average, radians (>= 0)
 * @param out receives `channels` values (overwritten)
 * @returns out
 */
export function sampleSkyMap(map: SkyMipMap, u: number, v: number, footprintRad: number, out: Float64Array): Float64Array {
  wrapIo[0] = u;
  wrapIo[1] = v;
  wrapIo[2] = footprintRad;
  return sampleSkyMapIo(map, wrapIo, out);
}

/**
 * sampleSkyMap for hot loops: arguments travel in a typed array, so no number is boxed by the call.
 * @param map the pyramid
 * @param io [0] u = RA / 360 degrees (any real, wraps), [1] v = (90 - Dec) / 180 degrees (0..1),
 *   [2] footprint in radians (>= 0); [0] and [3] are overwritten as scratch
 * @param out receives `channels` values (overwritten)
 * @returns out
 */
export function sampleSkyMapIo(map: SkyMipMap, io: Float64Array, out: Float64Array): Float64Array {
  const channels = map.channels;
  for (let k = 0; k < channels; k++) out[k] = 0;
  let uu = io[0] - Math.floor(io[0]);
  if (uu >= 1) uu = 0; // u a hair below an integer rounds up to 1
  io[0] = uu;
  const ratio = io[2] / map.texelRad;
  const last = map.levels.length - 1;
  io[3] = 1;
  if (!(ratio > 1)) {
    addBilinear(map.levels[0], channels, io, out);
    return out;
  }
  // mip level from the footprint (Williams 1983): log2 only when the footprint exceeds a texel
  const lod = Math.log2(ratio);
  if (lod >= last) {
    addBilinear(map.levels[last], channels, io, out);
    return out;
  }
  const l0 = Math.floor(lod);
  const f = lod - l0;
  io[3] = 1 - f;
  addBilinear(map.levels[l0], channels, io, out);
  if (f > 0) {
    io[3] = f;
    addBilinear(map.levels[l0 + 1], channels, io, out);
  }
  return out;
}

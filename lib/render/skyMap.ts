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

/** Bilinear sample of one level at (u, v) in [0,1) x [0,1], wrapping in u; adds weight * value into out. */
function addBilinear(level: MipLevel, channels: number, u: number, v: number, weight: number, out: Float64Array): void {
  const w = level.width;
  const h = level.height;
  const x = u * w - 0.5;
  let y = v * h - 0.5;
  if (y < 0) y = 0;
  if (y > h - 1) y = h - 1;
  const x0f = Math.floor(x);
  const y0 = Math.floor(y);
  const fx = x - x0f;
  const fy = y - y0;
  const x0 = ((x0f % w) + w) % w;
  const x1 = x0 + 1 === w ? 0 : x0 + 1;
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
  for (let k = 0; k < channels; k++) out[k] += w00 * d[i00 + k] + w10 * d[i10 + k] + w01 * d[i01 + k] + w11 * d[i11 + k];
}

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
  const channels = map.channels;
  for (let k = 0; k < channels; k++) out[k] = 0;
  const uu = u - Math.floor(u);
  const ratio = footprintRad / map.texelRad;
  const last = map.levels.length - 1;
  if (!(ratio > 1)) {
    addBilinear(map.levels[0], channels, uu, v, 1, out);
    return out;
  }
  const lod = Math.log2(ratio);
  if (lod >= last) {
    addBilinear(map.levels[last], channels, uu, v, 1, out);
    return out;
  }
  const l0 = Math.floor(lod);
  const f = lod - l0;
  addBilinear(map.levels[l0], channels, uu, v, 1 - f, out);
  if (f > 0) addBilinear(map.levels[l0 + 1], channels, uu, v, f, out);
  return out;
}

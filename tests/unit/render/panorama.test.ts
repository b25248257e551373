import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { renderFrameToImage } from '@/lib/render/node/renderFrame';

const DEG = Math.PI / 180;
const PANO_W = 720;
const PANO_H = 360;

/** Unit J2000 vector (textbook spherical to Cartesian). */
function unit(raDeg: number, decDeg: number): number[] {
  return [Math.cos(decDeg * DEG) * Math.cos(raDeg * DEG), Math.cos(decDeg * DEG) * Math.sin(raDeg * DEG), Math.sin(decDeg * DEG)];
}
const dot = (a: number[], b: number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: number[], b: number[]) => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];

/** sRGB decoding (IEC 61966-2-1) of a 16-bit code. */
function decode16(code: number): number {
  const c = code / 65535;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

describe('renderFrameToImage (panorama from a buffer)', () => {
  it('should put single-texel spots of a synthetic equirectangular image where the far-field gnomonic projection puts their RA and Dec', async () => {
    // Panorama layout (README): column c covers RA c..c+1 times 360/width degrees from RA 0h at the left
    // edge, row r covers Dec 90 - r..r+1 times 180/height; so texel (c, r) is centred on
    // RA (c + 0.5) * 0.5 deg, Dec 90 - (r + 0.5) * 0.5 deg here. Spots straddle RA 0h to check the wrap.
    const spots = [
      { name: 'red', channel: 0, c: 2, r: 159 }, // RA 1.25, Dec +10.25
      { name: 'green', channel: 1, c: 715, r: 151 }, // RA 357.75, Dec +14.25
      { name: 'blue', channel: 2, c: 10, r: 169 }, // RA 5.25, Dec +5.25
    ];
    const pixels = Buffer.alloc(PANO_W * PANO_H * 3);
    for (const s of spots) pixels[(s.r * PANO_W + s.c) * 3 + s.channel] = 255;
    const panoramaBuffer = await sharp(pixels, { raw: { width: PANO_W, height: PANO_H, channels: 3 } }).png().toBuffer();

    const hole = { raDeg: 0, decDeg: 10 };
    const size = 256;
    const fovDeg = 30;
    const image = await renderFrameToImage(
      {
        camera: { state: { kind: 'hover', radiusM: 1e7 }, holeDirection: hole },
        projection: { kind: 'flat', fovDeg },
        width: size,
        height: size,
        sky: { stars: { enabled: false }, milkyWay: { enabled: false }, panorama: { source: 'test-spots', gain: 1000 } },
        effects: { horizonGrid: { enabled: false }, farSideGrid: { enabled: false } },
        exposure: { ev: 0, toneMap: 'none' },
        output: { format: 'png16' },
      },
      { threads: 0, panoramaBuffer },
    );
    // sharp hands out 8-bit samples unless asked for the rgb16 colourspace (stack.md)
    const { data, info } = await sharp(image.bytes).toColourspace('rgb16').raw({ depth: 'ushort' }).toBuffer({ resolveWithObject: true });
    expect(info.width === size && info.height === size && info.channels === 3).toBe(true);
    const samples = new Uint16Array(data.buffer, data.byteOffset, data.byteLength / 2);

    // far field (r = 1e7 M, deflection ~4e-7 rad): plain gnomonic projection about the hole direction, up = celestial
    // north made orthogonal, right = centre x up (textbook construction, as in farField.test.ts)
    const centre = unit(hole.raDeg, hole.decDeg);
    const k = centre[2];
    const upRaw = [-k * centre[0], -k * centre[1], 1 - k * centre[2]];
    const n = Math.hypot(...upRaw);
    const up = upRaw.map((v) => v / n);
    const right = cross(centre, up);
    const f = size / 2 / Math.tan((fovDeg / 2) * DEG);
    for (const s of spots) {
      const d = unit((s.c + 0.5) * (360 / PANO_W), 90 - (s.r + 0.5) * (180 / PANO_H));
      const z = dot(d, centre);
      const px = size / 2 + (f * dot(d, right)) / z;
      const py = size / 2 - (f * dot(d, up)) / z;
      let w = 0;
      let sx = 0;
      let sy = 0;
      let other = 0;
      for (let y = Math.floor(py) - 8; y <= Math.floor(py) + 8; y++) {
        for (let x = Math.floor(px) - 8; x <= Math.floor(px) + 8; x++) {
          const i = (y * size + x) * 3;
          const l = decode16(samples[i + s.channel]);
          w += l;
          sx += l * (x + 0.5);
          sy += l * (y + 0.5);
          for (let c = 0; c < 3; c++) if (c !== s.channel) other += decode16(samples[i + c]);
        }
      }
      const err = Math.hypot(sx / w - px, sy / w - py);
      console.log(`${s.name} spot: predicted (${px.toFixed(2)}, ${py.toFixed(2)}), rendered centroid off by ${err.toFixed(3)} px, light ${w.toFixed(3)}, other channels ${other.toExponential(1)}`);
      expect(w).toBeGreaterThan(1);
      expect(other).toBeLessThan(1e-3 * w);
      expect(err).toBeLessThan(0.5);
    }
  });
});

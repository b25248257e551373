import { describe, expect, it } from 'vitest';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { adler32, adler32Combine, assemblePng, compressPngBand, pngBandBytes, writePngScanline } from '@/lib/render/node/png';

/** Deterministic pseudo-random bytes (xorshift32, common practice). */
function noise(n: number, seed: number): Uint8Array {
  const out = new Uint8Array(n);
  let s = seed >>> 0 || 1;
  for (let i = 0; i < n; i++) {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    out[i] = (s >>> 0) & 255;
  }
  return out;
}

/** The IDAT chunks' data, joined (PNG chunk layout: length, type, data, CRC; ISO/IEC 15948 section 5.3). */
function idatData(png: Buffer): Buffer {
  const parts: Buffer[] = [];
  for (let at = 8; at < png.length; ) {
    const length = png.readUInt32BE(at);
    const type = png.toString('latin1', at + 4, at + 8);
    const crc = png.readUInt32BE(at + 8 + length);
    expect(crc).toBe(zlib.crc32(png.subarray(at + 4, at + 8 + length)));
    if (type === 'IDAT') parts.push(png.subarray(at + 8, at + 8 + length));
    at += 12 + length;
  }
  return Buffer.concat(parts);
}

/** Encode samples band by band, as the render threads do. */
function encodeInBands(samples: Uint8Array | Uint16Array, width: number, height: number, bandRows: number): Buffer {
  const bitDepth = samples instanceof Uint16Array ? 16 : 8;
  const pieces = [];
  for (let y0 = 0; y0 < height; y0 += bandRows) {
    const y1 = Math.min(height, y0 + bandRows);
    const lines = new Uint8Array(pngBandBytes(width, y1 - y0, bitDepth));
    const lineBytes = pngBandBytes(width, 1, bitDepth);
    for (let y = y0; y < y1; y++) writePngScanline(samples, y * width * 3, width * 3, lines, (y - y0) * lineBytes);
    pieces.push(compressPngBand(lines, y1 === height));
  }
  return assemblePng(width, height, bitDepth, pieces);
}

describe('adler32', () => {
  it("should equal the checksum zlib writes at the end of a zlib stream, and combine like zlib's adler32_combine", () => {
    // RFC 1950: a zlib stream ends with the Adler-32 of the uncompressed data, big-endian (Node's zlib is the reference)
    for (const n of [0, 1, 3799, 3800, 3801, 100_000]) {
      const data = noise(n, n + 7);
      const z = zlib.deflateSync(data);
      expect(adler32(data)).toBe(z.readUInt32BE(z.length - 4));
    }
    const a = noise(12345, 1);
    const b = noise(54321, 2);
    const joined = new Uint8Array(a.length + b.length);
    joined.set(a);
    joined.set(b, a.length);
    expect(adler32Combine(adler32(a), adler32(b), b.length)).toBe(adler32(joined));
  });
});

describe('assemblePng', () => {
  it('should give a PNG that sharp (libvips) decodes to the same 8-bit samples, whatever the band size', async () => {
    const width = 97;
    const height = 41;
    const samples = noise(width * height * 3, 42);
    for (const bandRows of [1, 5, 41]) {
      const png = encodeInBands(samples, width, height, bandRows);
      const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
      expect(info.width === width && info.height === height && info.channels === 3).toBe(true);
      expect(Buffer.compare(data, Buffer.from(samples))).toBe(0);
      // the IDAT chunks' data joined must be one zlib stream (RFC 1950, Adler-32 checked by Node's zlib)
      // that inflates to the scanlines: filter byte 0, then the row's samples (ISO/IEC 15948)
      const inflated = zlib.inflateSync(idatData(png));
      expect(inflated.length).toBe(height * (1 + width * 3));
      expect(inflated[0]).toBe(0);
      expect(Buffer.compare(inflated.subarray(1, 1 + width * 3), Buffer.from(samples.subarray(0, width * 3)))).toBe(0);
    }
  });

  it('should give a 16-bit PNG that sharp decodes to the same samples', async () => {
    const width = 33;
    const height = 17;
    const bytes = noise(width * height * 6, 9);
    const samples = new Uint16Array(bytes.buffer);
    const png = encodeInBands(samples, width, height, 4);
    expect(png[24]).toBe(16); // IHDR bit depth byte (ISO/IEC 15948)
    const { data } = await sharp(png).toColourspace('rgb16').raw({ depth: 'ushort' }).toBuffer({ resolveWithObject: true });
    const decoded = new Uint16Array(data.buffer, data.byteOffset, data.byteLength / 2);
    let mismatches = 0;
    for (let i = 0; i < samples.length; i++) if (decoded[i] !== samples[i]) mismatches++;
    expect(mismatches).toBe(0);
  });
});

/**
 * PNG written band by band, so worker threads compress their own rows in
 * parallel (Node only: node:zlib). Each band of rows is deflated on its own
 * (RFC 1951) and ends with a sync flush, except the last, which finishes the
 * stream; the raw deflate pieces joined in row order form one valid zlib
 * stream (RFC 1950) once wrapped in its 2-byte header and the Adler-32 of all
 * the filtered rows, which is combined from the bands' own checksums. Each
 * piece travels in its own IDAT chunk (ISO/IEC 15948: the datastream is the
 * concatenation of the IDAT chunks' data). Rows use filter type 0 (none),
 * like sharp's default; colour type 2 (RGB), 8 or 16 bits per sample.
 */
import zlib from 'node:zlib';

/** zlib compression level of every band (sharp's default for PNG is 6 as well). */
export const PNG_DEFLATE_LEVEL = 6;
const ADLER_MOD = 65521;
const PNG_SIGNATURE = Uint8Array.from([137, 80, 78, 71, 13, 10, 26, 10]);

/** One compressed band: an IDAT chunk plus what the assembler needs to finish the zlib stream. */
export interface PngBandPiece {
  /** complete IDAT chunk (length, type, deflate data, CRC) */
  chunk: Uint8Array;
  /** Adler-32 of the band's filtered rows */
  adler: number;
  /** bytes of filtered rows in the band */
  length: number;
}

/**
 * Bytes of filtered rows (filter byte + samples) of a band.
 * @param width frame width, px
 * @param rows rows in the band
 * @param bitDepth 8 or 16
 */
export function pngBandBytes(width: number, rows: number, bitDepth: 8 | 16): number {
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(rows) || rows < 0) throw new RangeError('width, rows: integers, width >= 1, rows >= 0');
  return rows * (1 + width * 3 * (bitDepth / 8));
}

/**
 * Write one row of encoded samples as a PNG scanline (filter 0, big-endian 16-bit samples).
 * @param samples 3 samples per pixel for the row
 * @param from index of the row's first sample
 * @param count samples in the row (3 * width)
 * @param out scanline buffer
 * @param at index of the scanline's filter byte in out
 */
export function writePngScanline(samples: Uint8Array | Uint16Array, from: number, count: number, out: Uint8Array, at: number): void {
  out[at] = 0;
  if (samples instanceof Uint8Array) {
    out.set(samples.subarray(from, from + count), at + 1);
    return;
  }
  let o = at + 1;
  for (let i = 0; i < count; i++) {
    const v = samples[from + i];
    out[o++] = v >>> 8;
    out[o++] = v & 255;
  }
}

/**
 * Adler-32 checksum (RFC 1950 section 8.2).
 * @param data bytes
 * @returns checksum, unsigned 32-bit
 */
export function adler32(data: Uint8Array): number {
  let a = 1;
  let b = 0;
  let i = 0;
  const n = data.length;
  while (i < n) {
    // reduce every 3800 bytes: b then stays below 2^31, so the sums remain small integers for the JIT
    const end = Math.min(n, i + 3800);
    for (; i < end; i++) {
      a += data[i];
      b += a;
    }
    a %= ADLER_MOD;
    b %= ADLER_MOD;
  }
  return ((b << 16) | a) >>> 0;
}

/**
 * Adler-32 of the concatenation A + B from the checksums of A and B (zlib's adler32_combine).
 * @param adlerA checksum of A
 * @param adlerB checksum of B
 * @param lengthB length of B in bytes
 * @returns checksum of A + B
 */
export function adler32Combine(adlerA: number, adlerB: number, lengthB: number): number {
  const rem = lengthB % ADLER_MOD;
  const a1 = adlerA & 0xffff;
  const b1 = adlerA >>> 16;
  const a2 = adlerB & 0xffff;
  const b2 = adlerB >>> 16;
  const a = (a1 + a2 + ADLER_MOD - 1) % ADLER_MOD;
  const b = (((rem * a1) % ADLER_MOD) + b1 + b2 + ADLER_MOD - rem) % ADLER_MOD;
  return ((b << 16) | a) >>> 0;
}

/** A PNG chunk: length, type, data, CRC-32 of type and data (ISO/IEC 15948 section 5.3). */
function pngChunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  const view = new DataView(out.buffer);
  view.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  view.setUint32(8 + data.length, zlib.crc32(out.subarray(4, 8 + data.length)));
  return out;
}

/**
 * Compress a band's scanlines into its IDAT piece.
 * @param scanlines filtered rows of the band (pngBandBytes long)
 * @param last true for the frame's last band (finishes the deflate stream)
 * @returns the piece
 */
export function compressPngBand(scanlines: Uint8Array, last: boolean): PngBandPiece {
  const flush = last ? zlib.constants.Z_FINISH : zlib.constants.Z_SYNC_FLUSH;
  const data = zlib.deflateRawSync(scanlines, { level: PNG_DEFLATE_LEVEL, finishFlush: flush });
  return { chunk: pngChunk('IDAT', data), adler: adler32(scanlines), length: scanlines.length };
}

/**
 * Join band pieces, in row order, into a PNG file.
 * @param width px, 1..2^31-1
 * @param height px
 * @param bitDepth 8 or 16
 * @param pieces every band's piece, top band first (the last one made with last = true)
 * @returns PNG bytes
 */
export function assemblePng(width: number, height: number, bitDepth: 8 | 16, pieces: PngBandPiece[]): Buffer {
  if (!Number.isInteger(width) || width < 1 || width > 0x7fffffff) throw new RangeError('width: integer 1..2^31-1 px');
  if (!Number.isInteger(height) || height < 1 || height > 0x7fffffff) throw new RangeError('height: integer 1..2^31-1 px');
  if (bitDepth !== 8 && bitDepth !== 16) throw new RangeError('bitDepth: 8 or 16');
  if (pieces.length === 0 || pieces.some((p) => !p)) throw new RangeError('pieces: every band, at least one');
  const expected = pngBandBytes(width, height, bitDepth);
  const total = pieces.reduce((sum, p) => sum + p.length, 0);
  if (total !== expected) throw new RangeError(`pieces: ${total} bytes of scanlines, the image needs ${expected}`);
  const header = new Uint8Array(13);
  const view = new DataView(header.buffer);
  view.setUint32(0, width);
  view.setUint32(4, height);
  header[8] = bitDepth;
  header[9] = 2; // colour type 2: RGB triples
  // compression 0 (deflate), filter method 0, no interlace: bytes 10..12 stay 0
  let adler = 1; // Adler-32 of nothing
  for (const p of pieces) adler = adler32Combine(adler, p.adler, p.length);
  // zlib header: CM 8 (deflate), CINFO 7 (32 KiB window), FLEVEL 2 (default), FCHECK making it a multiple of 31
  const zlibHeader = Uint8Array.from([0x78, 0x9c]);
  const trailer = new Uint8Array(4);
  new DataView(trailer.buffer).setUint32(0, adler);
  const parts: Uint8Array[] = [PNG_SIGNATURE, pngChunk('IHDR', header), pngChunk('IDAT', zlibHeader)];
  for (const p of pieces) parts.push(p.chunk);
  parts.push(pngChunk('IDAT', trailer), pngChunk('IEND', new Uint8Array(0)));
  return Buffer.concat(parts);
}

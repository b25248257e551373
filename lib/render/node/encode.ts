/**
 * Encode rendered sRGB samples as PNG (8 or 16 bit) or JPEG through sharp
 * (Node only). sharp reads the sample depth from the typed array type
 * (stack.md), and 16-bit PNG needs the rgb16 colourspace.
 */
import sharp from 'sharp';

export type ImageFormat = 'png8' | 'png16' | 'jpeg';

/**
 * Encode an RGB image.
 * @param samples 3 samples per pixel, row-major from the top-left; Uint16Array only for png16
 * @param width px
 * @param height px
 * @param format png8, png16 or jpeg
 * @param jpegQuality 1..100 (JPEG only)
 * @returns encoded bytes; identical samples give identical bytes
 */
export async function encodeImage(
  samples: Uint8Array | Uint16Array,
  width: number,
  height: number,
  format: ImageFormat,
  jpegQuality = 92,
): Promise<Buffer> {
  if (samples.length !== width * height * 3) throw new RangeError('samples: length must be width * height * 3');
  if ((format === 'png16') !== samples instanceof Uint16Array) throw new RangeError('samples: Uint16Array for png16, Uint8Array otherwise');
  const image = sharp(samples, { raw: { width, height, channels: 3 }, limitInputPixels: false });
  if (format === 'png16') return image.toColourspace('rgb16').png({ compressionLevel: 6 }).toBuffer();
  if (format === 'png8') return image.png({ compressionLevel: 6 }).toBuffer();
  return image.jpeg({ quality: jpegQuality, chromaSubsampling: '4:4:4' }).toBuffer();
}

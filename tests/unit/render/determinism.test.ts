import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { createRenderPool, renderFrameToImage } from '@/lib/render/node/renderFrame';

const request = {
  camera: { state: { kind: 'radial', radiusM: 5, energy: 1 } },
  projection: { kind: 'dome', apertureDeg: 200 },
  width: 96,
  height: 96,
  supersampling: 2,
};

describe('renderFrameToImage', () => {
  it('should give identical bytes for the same request, in this thread or on a pool of 2 workers', async () => {
    // determinism is a requirement of issue 4 (reproducible frames); per-pixel independence and bands fixed by the
    // frame width (not by the thread count) make it exact
    const inThread = await renderFrameToImage(request, { threads: 0 });
    const pool2 = createRenderPool(2);
    try {
      const two = await renderFrameToImage(request, { pool: pool2 });
      const again = await renderFrameToImage(request, { pool: pool2 });
      expect(inThread.bytes.length).toBeGreaterThan(1000);
      expect(Buffer.compare(inThread.bytes, two.bytes)).toBe(0);
      expect(Buffer.compare(inThread.bytes, again.bytes)).toBe(0);
      // a camera the workers reject (energy too low to be at r = 5; with lensing off only the workers' frame plan
      // looks at it) fails with RangeError and leaves the pool usable
      const impossible = { ...request, camera: { state: { kind: 'radial', radiusM: 5, energy: 0.1 } }, effects: { lensing: false } };
      await expect(renderFrameToImage(impossible, { pool: pool2 })).rejects.toThrow(RangeError);
      const after = await renderFrameToImage(request, { pool: pool2 });
      expect(Buffer.compare(inThread.bytes, after.bytes)).toBe(0);
    } finally {
      await pool2.close();
    }
    // sharp (libvips) reads the PNG the threads assembled
    const meta = await sharp(inThread.bytes).metadata();
    expect(meta.width === 96 && meta.height === 96 && meta.channels === 3).toBe(true);
  }, 60_000);

  it('should write 16-bit PNG and JPEG when asked', async () => {
    const png16 = await renderFrameToImage({ ...request, output: { format: 'png16' } }, { threads: 0 });
    // PNG IHDR bit depth byte at offset 24 (PNG specification, ISO/IEC 15948)
    expect(png16.bytes[24]).toBe(16);
    const jpeg = await renderFrameToImage({ ...request, output: { format: 'jpeg' } }, { threads: 0 });
    // JPEG SOI marker FF D8 (ITU-T T.81)
    expect(jpeg.bytes[0] === 0xff && jpeg.bytes[1] === 0xd8).toBe(true);
  });
});

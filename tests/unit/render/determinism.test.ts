import { describe, expect, it } from 'vitest';
import { renderFrameToImage } from '@/lib/render/node/renderFrame';

const request = {
  camera: { state: { kind: 'radial', radiusM: 5, energy: 1 } },
  projection: { kind: 'dome', apertureDeg: 200 },
  width: 96,
  height: 96,
  supersampling: 2,
};

describe('renderFrameToImage', () => {
  it('should give identical bytes for the same request, whatever the threads and band sizes', async () => {
    // determinism is a requirement of issue 4 (reproducible frames); per-pixel independence makes it exact
    const a = await renderFrameToImage(request, { threads: 0, bandRows: 96 });
    const b = await renderFrameToImage(request, { threads: 0, bandRows: 7 });
    const c = await renderFrameToImage(request, { threads: 2, bandRows: 5 });
    expect(a.bytes.length).toBeGreaterThan(1000);
    expect(Buffer.compare(a.bytes, b.bytes)).toBe(0);
    expect(Buffer.compare(a.bytes, c.bytes)).toBe(0);
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

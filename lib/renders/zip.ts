import 'server-only';
import { ZipArchive } from 'archiver';
import { PassThrough, Readable } from 'node:stream';
import { getObjectStream } from '@/lib/storage/s3';
import type { DeliveryManifest } from './manifest';
import { photosensitivityReportText } from './photosensitivity';

/**
 * A delivery as one zip, streamed: frames are fetched from the object store
 * one at a time as the client reads, so the package is never held in memory.
 * PNG and JPEG are already compressed: they are stored, not deflated again.
 */
export function deliveryZipStream(manifest: DeliveryManifest, objectKeys: string[]): ReadableStream<Uint8Array> {
  const archive = new ZipArchive({ zlib: { level: 6 } });
  const output = new PassThrough();
  archive.on('error', (error: Error) => output.destroy(error));
  archive.pipe(output);
  // Entries written so far; the next frame is fetched only when the previous one is in the zip.
  let written = 0;
  let wake: (() => void) | null = null;
  archive.on('entry', () => {
    written++;
    wake?.();
  });
  const entriesWritten = (n: number) => new Promise<void>((resolve) => {
    const check = () => (written >= n ? resolve() : (wake = check));
    check();
  });
  (async () => {
    archive.append(JSON.stringify(manifest, null, 2), { name: 'manifest.json' });
    archive.append(photosensitivityReportText(manifest), { name: 'photosensitivity-report.txt' });
    for (const [i, frame] of manifest.frames.entries()) {
      await entriesWritten(i + 2);
      archive.append(await getObjectStream(objectKeys[i]), { name: `frames/${frame.file}`, store: true });
    }
    await archive.finalize();
  })().catch((error: unknown) => archive.abort() && output.destroy(error as Error));
  return Readable.toWeb(output) as ReadableStream<Uint8Array>;
}

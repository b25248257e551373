import 'server-only';
import sharp, { type OutputInfo } from 'sharp';
import type { Projection } from '@/lib/render/schema';
import { createFlashDetector, type FlashReport } from '@/lib/safety/flashDetector';
import { summariseFlashReport, VENUE_POLICY_CAUTION } from '@/lib/safety/summary';
import { getObjectBytes } from '@/lib/storage/s3';
import type { DeliveryManifest } from './manifest';

/** Frames are analysed at this size at most: finer than the detector's 0.25-degree cells for a 180-degree dome master. */
const ANALYSIS_MAX_SIDE_PX = 1024;

/** A stored frame as 8-bit RGB at the analysis size. */
async function decodeForAnalysis(key: string): Promise<{ data: Buffer; info: OutputInfo }> {
  return sharp(await getObjectBytes(key))
    .resize(ANALYSIS_MAX_SIDE_PX, ANALYSIS_MAX_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
}

/**
 * Runs the WCAG 2.2 SC 2.3.1 / ITU-R BT.1702 flash check over stored frames, in order. The next frame is
 * fetched and decoded (sharp's threads) while this one is analysed, so at most two frames are in memory.
 */
export async function analyseSequence(objectKeys: string[], frameRate: number, projection: Projection): Promise<FlashReport & { summary: string }> {
  let detector: ReturnType<typeof createFlashDetector> | null = null;
  let next = objectKeys.length > 0 ? decodeForAnalysis(objectKeys[0]) : null;
  for (let i = 0; next !== null; i++) {
    const { data, info } = await next;
    next = i + 1 < objectKeys.length ? decodeForAnalysis(objectKeys[i + 1]) : null;
    // a failed prefetch is reported when its turn comes, not as an unhandled rejection meanwhile
    next?.catch(() => {});
    detector ??= createFlashDetector({ width: info.width, height: info.height, frameRate, projection, encoding: 'srgb', channels: 3 });
    detector.addFrame(new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
  }
  if (!detector) throw new Error('no frames to analyse');
  const report = detector.finish();
  return { ...report, summary: summariseFlashReport(report, { dome: projection.kind === 'dome' }) };
}

/** photosensitivity-report.txt inside a delivery zip. */
export function photosensitivityReportText(manifest: DeliveryManifest): string {
  const report = manifest.photosensitivity as (FlashReport & { summary?: string }) | null;
  if (!report || !('verdict' in report)) return `No photosensitivity check was recorded.\n${VENUE_POLICY_CAUTION}\n`;
  return [
    `Skywell photosensitivity report: ${manifest.scene.show} / ${manifest.scene.name}, revision ${manifest.revision.number} (${manifest.revision.contentHash})`,
    '',
    `Verdict: ${report.verdict.toUpperCase()}`,
    report.summary ?? '',
    '',
    'Method',
    report.method ?? '',
    '',
  ].join('\n');
}

import { createHash } from 'node:crypto';
import sharp from 'sharp';
import type { Studio } from '@/models';
import { Delivery, Frame, RenderJob, SceneRevision } from '@/models';
import { putImmutable } from '@/lib/storage/s3';
import type { DeliveryManifest } from '@/lib/renders/manifest';

/** A cancelled (or running) render with one stored frame and a delivery, made directly (no worker needed). */
export async function makeRenderWithDelivery(studio: Studio, sceneId: string, requestedById: string, status: 'cancelled' | 'running' = 'cancelled', approved = true) {
  const revision = (await SceneRevision.findOne({ where: { sceneId, number: 1 } }))!;
  const job = await RenderJob.create({
    studioId: studio.id, sceneId, revisionId: revision.id, kind: 'sequence', status,
    settings: { width: 8, height: 8, format: 'png8', supersampling: 1 }, frameStart: 0, frameCount: 2,
    photosensitivity: null, error: null, requestedById, startedAt: new Date(), finishedAt: new Date(),
  });
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: { r: 10, g: 20, b: 30 } } }).png().toBuffer();
  const sha256 = createHash('sha256').update(png).digest('hex');
  const objectKey = `studios/${studio.id}/renders/${job.id}/fixture_0000.png`;
  await putImmutable(objectKey, png, sha256, 'image/png');
  const readout = { properTimeM: 0, properTimeSeconds: 0, radiusRs: 40, radiusKm: 1, speedRelativeToHover: 0, shiftMin: 1, shiftMax: 1, countdownSeconds: null, exposureEv: 0 };
  await Frame.create({ studioId: studio.id, renderJobId: job.id, index: 0, objectKey, bytes: png.length, sha256, readout, renderMs: 1, worker: 'fixture' });
  const manifest: DeliveryManifest = {
    format: 'skywell-delivery/1', scene: { name: 'Fixture', slug: 'fixture', show: 'Fixture show' }, revision: { number: 1, contentHash: revision.contentHash, approved },
    massSolar: 10, frameRate: 30, resolution: { width: 8, height: 8 }, projection: { kind: 'flat', fovDeg: 60 }, exposure: { ev: 0, toneMap: 'exponential' }, output: 'png8',
    frames: [{ index: 0, file: 'fixture_0000.png', sha256, bytes: png.length, ...readout }], photosensitivity: null, nonPhysicalChoices: [], createdAt: new Date().toISOString(),
  };
  const delivery = await Delivery.create({ studioId: studio.id, renderJobId: job.id, manifest, loadedAt: null, loadedById: null });
  return { job, delivery };
}

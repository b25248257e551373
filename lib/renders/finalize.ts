import 'server-only';
import { sendEmail } from '@/lib/email/send';
import { appUrl } from '@/lib/env';
import { listNonPhysicalChoices } from '@/lib/render/schema';
import { Delivery, Frame, RenderJob, Scene, SceneRevision, Show, Studio, User, sequelize } from '@/models';
import { analyseSequence } from './photosensitivity';
import { renderRequestFor } from './frames';
import type { DeliveryManifest } from './manifest';
import { frameFileName } from './settings';

async function notify(job: RenderJob, subject: string, lines: string[]): Promise<void> {
  if (!job.requestedById) return;
  const [person, studio] = await Promise.all([User.findByPk(job.requestedById), Studio.findByPk(job.studioId)]);
  if (!person || !studio) return;
  await sendEmail({ studioId: job.studioId, kind: 'render', to: person.email, subject, text: [...lines, '', `Open it: ${appUrl}/studios/${studio.slug}/renders/${job.id}`].join('\n') });
}

/**
 * Runs once per finished render (a row lock makes concurrent workers agree):
 * the photosensitivity check over the whole sequence, the delivery with its
 * manifest, and the e-mail to whoever asked for the render.
 */
export async function finalizeRender(renderJobId: string): Promise<void> {
  const outcome = await sequelize.transaction(async (transaction) => {
    const job = await RenderJob.findByPk(renderJobId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!job || job.status !== 'done' || job.photosensitivity !== null) return null;
    const [revision, scene] = await Promise.all([SceneRevision.findByPk(job.revisionId, { transaction }), Scene.findByPk(job.sceneId, { transaction })]);
    const show = scene ? await Show.findByPk(scene.showId, { transaction }) : null;
    if (!revision || !scene || !show) return null;
    const frames = await Frame.findAll({ where: { renderJobId }, order: [['index', 'ASC']], transaction });
    const spec = revision.spec;
    const photosensitivity = job.kind === 'sequence'
      ? await analyseSequence(frames.map((f) => f.objectKey), spec.pacing.frameRate, spec.projection)
      : { verdict: 'not-applicable', summary: 'A still has no flashes; the photosensitivity check applies to sequences.' };
    await job.update({ photosensitivity: photosensitivity as unknown as Record<string, unknown> }, { transaction });
    if (job.kind === 'sequence') {
      const sample = renderRequestFor(spec, 0, job.settings);
      const manifest: DeliveryManifest = {
        format: 'skywell-delivery/1',
        scene: { name: scene.name, slug: scene.slug, show: show.name },
        revision: { number: revision.number, contentHash: revision.contentHash, approved: !job.draft },
        massSolar: spec.massSolar,
        frameRate: spec.pacing.frameRate,
        resolution: { width: job.settings.width, height: job.settings.height },
        projection: spec.projection,
        exposure: { ev: spec.exposure.ev, toneMap: spec.exposure.toneMap },
        output: job.settings.format,
        frames: frames.map((f) => ({ index: f.index, file: frameFileName(scene.slug, f.index, job.settings.format), sha256: f.sha256, bytes: f.bytes, ...f.readout })),
        photosensitivity,
        nonPhysicalChoices: listNonPhysicalChoices(sample),
        createdAt: new Date().toISOString(),
      };
      await Delivery.findOrCreate({ where: { renderJobId }, defaults: { studioId: job.studioId, renderJobId, manifest, loadedAt: null, loadedById: null }, transaction });
    }
    return { job, scene, verdict: (photosensitivity as { verdict: string }).verdict };
  });
  if (outcome) {
    const { job, scene, verdict } = outcome;
    await notify(job, `Render finished: ${scene.name}`, [
      `The ${job.kind} of "${scene.name}" finished: ${job.frameCount} frame${job.frameCount === 1 ? '' : 's'}.`,
      job.kind === 'sequence' ? `Photosensitivity check: ${verdict}. Venue policy and local rules decide what may be shown.` : '',
    ]);
  }
}

/** Records a frame that failed for good; the render fails once every frame is stored or failed. */
export async function failRender(renderJobId: string, index: number, message: string): Promise<void> {
  const failedNow = await sequelize.transaction(async (transaction) => {
    const job = await RenderJob.findByPk(renderJobId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!job || job.status === 'cancelled' || job.status === 'done' || job.status === 'failed') return null;
    const framesFailed = job.framesFailed + 1;
    const finished = framesFailed + job.framesDone >= job.frameCount;
    await job.update({ framesFailed, error: `frame ${index}: ${message}`.slice(0, 2000), ...(finished ? { status: 'failed', finishedAt: new Date() } : {}) }, { transaction });
    return finished ? job : null;
  });
  if (failedNow) {
    const scene = await Scene.findByPk(failedNow.sceneId);
    await notify(failedNow, `Render failed: ${scene?.name ?? 'scene'}`, [
      `The ${failedNow.kind} of "${scene?.name ?? 'a scene'}" stopped: ${failedNow.framesFailed} frame(s) failed after retries (last error: ${message}).`,
      'Finished frames are kept; use "Retry failed frames" on the render page.',
    ]);
  }
}

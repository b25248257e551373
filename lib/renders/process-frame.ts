import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { renderFrameToImage, type RenderPool } from '@/lib/render/node/renderFrame';
import { readoutAt, sceneWorldline } from '@/lib/scenes/readout';
import { putImmutable } from '@/lib/storage/s3';
import { Frame, RenderJob, Scene, SceneRevision, sequelize } from '@/models';
import { properTimeOfFrame, renderRequestFor } from './frames';
import { frameFileName, type FrameReadout } from './settings';

export type FrameOutcome = 'rendered' | 'already-stored' | 'skipped-cancelled' | 'skipped-missing';

/** Object key of a frame: deterministic, so a retry finds what an earlier attempt stored. */
export function frameObjectKey(studioId: string, jobId: string, fileName: string): string {
  return `studios/${studioId}/renders/${jobId}/${fileName}`;
}

/**
 * Renders one frame of a render job and records it. Safe to run twice for
 * the same frame (a crashed worker's job is retried): a frame already
 * recorded is skipped, an identical stored object is reused, and the
 * (job, index) row is unique.
 */
export async function processFrame(renderJobId: string, index: number, context: { pool?: RenderPool; workerName: string }): Promise<FrameOutcome> {
  const job = await RenderJob.findByPk(renderJobId);
  if (!job) return 'skipped-missing';
  if (job.status === 'cancelled' || job.status === 'done') return 'skipped-cancelled';
  if (await Frame.findOne({ where: { renderJobId, index }, attributes: ['id'] })) return 'already-stored';
  await RenderJob.update({ status: 'running', startedAt: job.startedAt ?? new Date() }, { where: { id: renderJobId, status: 'queued' } });

  const [revision, scene] = await Promise.all([SceneRevision.findByPk(job.revisionId), Scene.findByPk(job.sceneId)]);
  if (!revision || !scene) return 'skipped-missing';
  const spec = revision.spec;
  const tau = properTimeOfFrame(spec, index);
  const request = renderRequestFor(spec, tau, job.settings);
  const started = performance.now();
  const image = await renderFrameToImage(request, { pool: context.pool, threads: context.pool ? undefined : 0 });
  const renderMs = Math.round(performance.now() - started);

  const sha256 = createHash('sha256').update(image.bytes).digest('hex');
  const fileName = frameFileName(scene.slug, index, job.settings.format);
  const objectKey = frameObjectKey(job.studioId, job.id, fileName);
  await putImmutable(objectKey, image.bytes, sha256, job.settings.format === 'jpeg' ? 'image/jpeg' : 'image/png');

  const physics = readoutAt(spec, sceneWorldline(spec), tau);
  const readout: FrameReadout = {
    properTimeM: physics.tau, properTimeSeconds: physics.tauSeconds, radiusRs: physics.radiusRs, radiusKm: physics.radiusKm,
    speedRelativeToHover: physics.speedRelativeToHover, shiftMin: physics.shiftRange?.min ?? null, shiftMax: physics.shiftRange?.max ?? null,
    countdownSeconds: physics.countdownSeconds, exposureEv: spec.exposure.ev,
  };
  await Frame.bulkCreate(
    [{ studioId: job.studioId, renderJobId, index, objectKey, bytes: image.bytes.length, sha256, readout, renderMs, worker: context.workerName }],
    { ignoreDuplicates: true },
  );
  await refreshProgress(renderJobId);
  return 'rendered';
}

/** Recounts stored frames (idempotent) and returns whether this call saw the job complete first. */
export async function refreshProgress(renderJobId: string): Promise<boolean> {
  const [row] = await sequelize.query<{ completed: boolean }>(
    `UPDATE render_jobs SET frames_done = counted.n, updated_at = now(),
       status = CASE WHEN counted.n >= frame_count AND status IN ('queued', 'running') THEN 'done'::enum_render_jobs_status ELSE status END,
       finished_at = CASE WHEN counted.n >= frame_count AND status IN ('queued', 'running') THEN now() ELSE finished_at END
     FROM (SELECT count(*)::int AS n FROM frames WHERE render_job_id = :id) counted
     WHERE id = :id
     RETURNING (status = 'done' AND finished_at = now()) AS completed`,
    { replacements: { id: renderJobId }, type: QueryTypes.SELECT },
  );
  return row?.completed ?? false;
}

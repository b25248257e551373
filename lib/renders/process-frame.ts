import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Worldline } from '@/lib/relativity';
import { renderFrameToImage, type RenderPool } from '@/lib/render/node/renderFrame';
import { readoutAt, sceneWorldline } from '@/lib/scenes/readout';
import { putImmutable } from '@/lib/storage/s3';
import { Frame, RenderJob, Scene, SceneRevision, sequelize } from '@/models';
import { properTimeOfFrame, renderRequestFor } from './frames';
import { frameFileName, type FrameReadout } from './settings';

/** Why a frame was not rendered (renderJobFrame returns one of these instead of a frame). */
export type FrameSkip = 'already-stored' | 'skipped-cancelled' | 'skipped-missing';

/** Object key of a frame: deterministic, so a retry finds what an earlier attempt stored. */
export function frameObjectKey(studioId: string, jobId: string, fileName: string): string {
  return `studios/${studioId}/renders/${jobId}/${fileName}`;
}

/** A rendered frame waiting to be stored (the output of {@link renderJobFrame}). */
export interface RenderedFrame {
  renderJobId: string;
  index: number;
  studioId: string;
  format: RenderJob['settings']['format'];
  sceneSlug: string;
  spec: SceneRevision['spec'];
  worldline: Worldline;
  tau: number;
  bytes: Buffer;
  renderMs: number;
}

/** What a worker keeps of a revision it renders: the spec, its built path and the scene's slug. */
interface CachedRevision {
  spec: SceneRevision['spec'];
  worldline: Worldline;
  sceneSlug: string;
}

// Revisions are immutable, so a worker keeps the few it is rendering in memory, path built once: every frame
// reads it three times (frame time, request, readouts), and a free fall's path is an integration.
const revisionCache = new Map<string, CachedRevision>();
const REVISION_CACHE_SIZE = 16;

async function revisionOf(job: RenderJob): Promise<CachedRevision | null> {
  const cached = revisionCache.get(job.revisionId);
  if (cached) return cached;
  const [revision, scene] = await Promise.all([SceneRevision.findByPk(job.revisionId), Scene.findByPk(job.sceneId, { attributes: ['slug'] })]);
  if (!revision || !scene) return null;
  const entry = { spec: revision.spec, worldline: sceneWorldline(revision.spec), sceneSlug: scene.slug };
  if (revisionCache.size >= REVISION_CACHE_SIZE) revisionCache.delete(revisionCache.keys().next().value!);
  revisionCache.set(job.revisionId, entry);
  return entry;
}

/**
 * First stage of a frame: checks the job still wants it, then renders it.
 * Returns the outcome when there is nothing to render (cancelled, finished,
 * already stored, or gone).
 */
export async function renderJobFrame(renderJobId: string, index: number, context: { pool?: RenderPool }): Promise<RenderedFrame | FrameSkip> {
  const job = await RenderJob.findByPk(renderJobId);
  if (!job) return 'skipped-missing';
  if (job.status === 'cancelled' || job.status === 'done') return 'skipped-cancelled';
  if (await Frame.findOne({ where: { renderJobId, index }, attributes: ['id'] })) return 'already-stored';
  if (job.status === 'queued') await RenderJob.update({ status: 'running', startedAt: job.startedAt ?? new Date() }, { where: { id: renderJobId, status: 'queued' } });

  const revision = await revisionOf(job);
  if (!revision) return 'skipped-missing';
  const tau = properTimeOfFrame(revision.spec, index, revision.worldline);
  const request = renderRequestFor(revision.spec, tau, job.settings, revision.worldline);
  const started = performance.now();
  const image = await renderFrameToImage(request, { pool: context.pool, threads: context.pool ? undefined : 0 });
  const renderMs = Math.round(performance.now() - started);
  // a render cancelled while this frame was drawn keeps no further frames
  const after = await RenderJob.findByPk(renderJobId, { attributes: ['status'] });
  if (!after || after.status === 'cancelled') return 'skipped-cancelled';
  return {
    renderJobId, index, studioId: job.studioId, format: job.settings.format, sceneSlug: revision.sceneSlug,
    spec: revision.spec, worldline: revision.worldline, tau, bytes: image.bytes, renderMs,
  };
}

/**
 * Second stage: stores the frame's bytes under its deterministic key (an
 * identical object already there is reused), records the frame with its
 * readouts (the (job, index) row is unique) and recounts progress.
 * @returns whether this call saw the render complete
 */
export async function storeRenderedFrame(frame: RenderedFrame, workerName: string): Promise<{ completed: boolean }> {
  const sha256 = createHash('sha256').update(frame.bytes).digest('hex');
  const fileName = frameFileName(frame.sceneSlug, frame.index, frame.format);
  const objectKey = frameObjectKey(frame.studioId, frame.renderJobId, fileName);
  await putImmutable(objectKey, frame.bytes, sha256, frame.format === 'jpeg' ? 'image/jpeg' : 'image/png');

  const physics = readoutAt(frame.spec, frame.worldline, frame.tau);
  const readout: FrameReadout = {
    properTimeM: physics.tau, properTimeSeconds: physics.tauSeconds, radiusRs: physics.radiusRs, radiusKm: physics.radiusKm,
    speedRelativeToHover: physics.speedRelativeToHover, shiftMin: physics.shiftRange?.min ?? null, shiftMax: physics.shiftRange?.max ?? null,
    countdownSeconds: physics.countdownSeconds, exposureEv: frame.spec.exposure.ev,
  };
  await Frame.bulkCreate(
    [{ studioId: frame.studioId, renderJobId: frame.renderJobId, index: frame.index, objectKey, bytes: frame.bytes.length, sha256, readout, renderMs: frame.renderMs, worker: workerName }],
    { ignoreDuplicates: true },
  );
  return { completed: await refreshProgress(frame.renderJobId) };
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

import 'server-only';
import { Op } from 'sequelize';
import { z } from 'zod';
import { env } from '@/lib/env';
import { badRequest, conflict, notFound, tooManyRequests } from '@/lib/errors';
import { queue, RENDER_FRAME_QUEUE, type RenderFrameJob } from '@/lib/queue/boss';
import { findRevision, findScene } from '@/lib/scenes/service';
import { approvalOf } from '@/lib/reviews/service';
import { audit } from '@/lib/studio/audit';
import { Frame, RenderJob, sequelize } from '@/models';
import { sequenceFrameCount } from './frames';
import { renderSettingsSchema } from './settings';

export const renderRequestSchema = z.strictObject({
  sceneId: z.string().uuid('sceneId must be the id of a scene in this studio'),
  revision: z.number().int().min(1, 'revision must be a revision number'),
  kind: z.enum(['still', 'sequence'], { error: 'kind must be still or sequence' }),
  /** still: which frame of the sequence; sequence: first and last frame (inclusive). */
  frames: z.strictObject({ start: z.number().int().min(0, 'frames.start must be 0 or more'), end: z.number().int().min(0) }).optional(),
  settings: renderSettingsSchema,
});
export type RenderRequest = z.infer<typeof renderRequestSchema>;

export type RenderJobView = {
  id: string; sceneId: string; sceneName: string; revision: number; kind: 'still' | 'sequence'; status: string;
  frameStart: number; frameCount: number; framesDone: number; framesFailed: number; draft: boolean;
  settings: unknown; error: string | null; photosensitivity: unknown; createdAt: string; startedAt: string | null; finishedAt: string | null;
};

export function renderJobView(job: RenderJob, sceneName: string, revision: number): RenderJobView {
  return {
    id: job.id, sceneId: job.sceneId, sceneName, revision, kind: job.kind, status: job.status,
    frameStart: job.frameStart, frameCount: job.frameCount, framesDone: job.framesDone, framesFailed: job.framesFailed, draft: job.draft,
    settings: job.settings, error: job.error, photosensitivity: job.photosensitivity,
    createdAt: job.createdAt.toISOString(), startedAt: job.startedAt?.toISOString() ?? null, finishedAt: job.finishedAt?.toISOString() ?? null,
  };
}

/** Frames still waiting or rendering in a studio, for the per-studio quota. */
async function queuedFrames(studioId: string): Promise<number> {
  const rows = await RenderJob.findAll({ where: { studioId, status: { [Op.in]: ['queued', 'running'] } }, attributes: ['frameCount', 'framesDone'] });
  return rows.reduce((sum, j) => sum + (j.frameCount - j.framesDone), 0);
}

async function enqueueFrames(jobId: string, indices: number[]): Promise<void> {
  const boss = await queue();
  // Earlier frames first (higher priority), so a sequence fills in from its start.
  // singletonKey makes a frame's job unique while it is queued or active: enqueueing twice does not render twice.
  await boss.insert(indices.map((index) => ({ name: RENDER_FRAME_QUEUE, data: { renderJobId: jobId, index } satisfies RenderFrameJob, priority: 1_000_000 - index, singletonKey: `${jobId}:${index}`, retryLimit: 3, retryDelay: 2, expireInSeconds: env.RENDER_FRAME_TIMEOUT_SECONDS })));
}

/** Validates a render request against the scene, the limits and the studio's quota, then queues one job per frame. */
export async function requestRender(studioId: string, actorId: string, request: RenderRequest): Promise<RenderJobView> {
  const scene = await findScene(studioId, request.sceneId);
  const revision = await findRevision(studioId, scene.id, request.revision);
  const { width, height } = request.settings;
  const maxSide = env.RENDER_MAX_SIDE_PX;
  if (width > maxSide || height > maxSide) throw badRequest(`width and height must be at most ${maxSide} pixels (RENDER_MAX_SIDE_PX).`, { errors: [{ field: width > maxSide ? 'settings.width' : 'settings.height', message: `at most ${maxSide}` }] });
  const projection = revision.spec.projection;
  if ((projection.kind === 'dome' || projection.kind === 'cubeFace') && width !== height) {
    throw badRequest(`A ${projection.kind === 'dome' ? 'dome master' : 'cube face'} is square: make height equal to width (${width}).`, { errors: [{ field: 'settings.height', message: `must equal width (${width})` }] });
  }
  const total = sequenceFrameCount(revision.spec);
  const start = request.frames?.start ?? 0;
  const end = request.kind === 'still' ? start : (request.frames?.end ?? total - 1);
  if (start > total - 1 || end > total - 1 || end < start) {
    throw badRequest(`frames must lie within 0 to ${total - 1}: the scene's pacing gives ${total} frames.`, { errors: [{ field: 'frames', message: `within 0..${total - 1}, start <= end` }] });
  }
  const count = end - start + 1;
  if (count > env.RENDER_MAX_FRAMES_PER_JOB) throw badRequest(`A render may have at most ${env.RENDER_MAX_FRAMES_PER_JOB} frames (RENDER_MAX_FRAMES_PER_JOB); split the range.`);
  const waiting = await queuedFrames(studioId);
  if (waiting + count > env.RENDER_MAX_QUEUED_FRAMES_PER_STUDIO) {
    throw tooManyRequests(`The studio already has ${waiting} frames queued; at most ${env.RENDER_MAX_QUEUED_FRAMES_PER_STUDIO} may wait at once (RENDER_MAX_QUEUED_FRAMES_PER_STUDIO). Wait for renders to finish or cancel one.`);
  }
  const approved = (await approvalOf(revision.id)) !== null;
  const job = await sequelize.transaction(async (transaction) => {
    const created = await RenderJob.create(
      // A render of an unapproved revision is a draft: marked so in its manifest, never a final delivery.
      { studioId, sceneId: scene.id, revisionId: revision.id, kind: request.kind, settings: request.settings, frameStart: start, frameCount: count, draft: !approved, photosensitivity: null, error: null, requestedById: actorId, startedAt: null, finishedAt: null },
      { transaction },
    );
    await audit({ studioId, actorId, action: 'render.requested', targetType: 'render_job', targetId: created.id, data: { sceneId: scene.id, revision: revision.number, kind: request.kind, frames: [start, end] } }, transaction);
    return created;
  });
  await enqueueFrames(job.id, Array.from({ length: count }, (_, i) => start + i));
  return renderJobView(job, scene.name, revision.number);
}

export async function findRenderJob(studioId: string, jobId: string): Promise<RenderJob> {
  const job = await RenderJob.findOne({ where: { id: jobId, studioId } });
  if (!job) throw notFound('Render');
  return job;
}

/** Cancels a render: frames already stored stay; queued frames are skipped by the workers. */
export async function cancelRender(studioId: string, actorId: string, jobId: string): Promise<void> {
  const job = await findRenderJob(studioId, jobId);
  if (job.status === 'done' || job.status === 'cancelled') throw conflict(`This render is already ${job.status}.`);
  await job.update({ status: 'cancelled', finishedAt: new Date() });
  await audit({ studioId, actorId, action: 'render.cancelled', targetType: 'render_job', targetId: jobId });
}

/** Queues again every frame of a failed or cancelled render that has no stored frame yet. */
export async function retryRender(studioId: string, actorId: string, jobId: string): Promise<number> {
  const job = await findRenderJob(studioId, jobId);
  if (job.status === 'done') throw conflict('This render has finished; nothing to retry.');
  if (job.status === 'queued' || job.status === 'running') {
    if (job.framesFailed === 0) throw conflict('This render is still in progress with no failed frames.');
  }
  const stored = new Set((await Frame.findAll({ where: { renderJobId: jobId }, attributes: ['index'] })).map((f) => f.index));
  const missing = Array.from({ length: job.frameCount }, (_, i) => job.frameStart + i).filter((i) => !stored.has(i));
  await job.update({ status: 'queued', framesFailed: 0, error: null, finishedAt: null });
  await enqueueFrames(jobId, missing);
  await audit({ studioId, actorId, action: 'render.retried', targetType: 'render_job', targetId: jobId, data: { frames: missing.length } });
  return missing.length;
}

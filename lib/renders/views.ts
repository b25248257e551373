import 'server-only';
import { Delivery, Frame, RenderJob, Scene, SceneRevision } from '@/models';
import { notFound } from '@/lib/errors';
import { renderJobView, type RenderJobView } from './service';

/** Renders of a studio, newest first, with scene names and revision numbers. */
export async function listRenders(studioId: string, limit = 100): Promise<RenderJobView[]> {
  const jobs = await RenderJob.findAll({
    where: { studioId },
    include: [{ model: Scene, as: 'scene', attributes: ['name'] }, { model: SceneRevision, as: 'revision', attributes: ['number'] }],
    order: [['createdAt', 'DESC']],
    limit,
  });
  return jobs.map((j) => {
    const rel = j as unknown as { scene?: Scene; revision?: SceneRevision };
    return renderJobView(j, rel.scene?.name ?? '', rel.revision?.number ?? 0);
  });
}

export async function renderDetail(studioId: string, renderId: string) {
  const job = await RenderJob.findOne({
    where: { id: renderId, studioId },
    include: [{ model: Scene, as: 'scene', attributes: ['name', 'slug'] }, { model: SceneRevision, as: 'revision', attributes: ['number', 'contentHash'] }],
  });
  if (!job) throw notFound('Render');
  const rel = job as unknown as { scene: Scene; revision: SceneRevision };
  const frames = await Frame.findAll({ where: { renderJobId: job.id }, order: [['index', 'ASC']] });
  const delivery = await Delivery.findOne({ where: { renderJobId: job.id }, attributes: ['id', 'status'] });
  const renderMs = frames.map((f) => f.renderMs);
  const minutes = job.startedAt ? (Date.now() - job.startedAt.getTime()) / 60_000 : 0;
  const framesPerMinute = frames.length && minutes > 0 ? frames.length / (job.finishedAt ? (job.finishedAt.getTime() - job.startedAt!.getTime()) / 60_000 || minutes : minutes) : null;
  const remaining = job.frameCount - job.framesDone;
  return {
    render: renderJobView(job, rel.scene.name, rel.revision.number),
    contentHash: rel.revision.contentHash,
    frames: frames.map((f) => ({ index: f.index, sha256: f.sha256, bytes: f.bytes, readout: f.readout, renderMs: f.renderMs, worker: f.worker })),
    framesPerMinute,
    secondsLeft: framesPerMinute && remaining > 0 && (job.status === 'running' || job.status === 'queued') ? Math.round((remaining / framesPerMinute) * 60) : null,
    meanRenderMs: renderMs.length ? Math.round(renderMs.reduce((a, b) => a + b, 0) / renderMs.length) : null,
    delivery: delivery ? { id: delivery.id, status: delivery.status } : null,
  };
}

export async function findFrame(studioId: string, renderId: string, index: number): Promise<Frame> {
  const frame = await Frame.findOne({ where: { studioId, renderJobId: renderId, index } });
  if (!frame) throw notFound(`Frame ${index}`);
  return frame;
}

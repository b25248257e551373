import 'server-only';
import os from 'node:os';
import type PgBoss from 'pg-boss';
import { env } from '@/lib/env';
import { createRenderPool, type RenderPool } from '@/lib/render/node/renderFrame';
import { queue, RENDER_FRAME_QUEUE, stopQueue, type RenderFrameJob } from '@/lib/queue/boss';
import { RenderJob, sequelize } from '@/models';
import { processFrame } from './process-frame';
import { finalizeRender, failRender } from './finalize';

/**
 * A render worker: takes one frame at a time from the PostgreSQL queue and
 * renders it on all local cores. Run as many as you like, on any machine that
 * reaches the same database and object store.
 */
export async function runWorker(workerName: string, log: (line: string) => void = console.log): Promise<{ stop: () => Promise<void> }> {
  const threads = env.RENDER_THREADS ?? os.availableParallelism();
  const pool: RenderPool = createRenderPool(threads);
  const boss = await queue();

  await boss.work<RenderFrameJob>(RENDER_FRAME_QUEUE, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: 0.5 }, async (jobs: PgBoss.JobWithMetadata<RenderFrameJob>[]) => {
    for (const job of jobs) {
      const { renderJobId, index } = job.data;
      try {
        const outcome = await processFrame(renderJobId, index, { pool, workerName });
        log(`[${workerName}] render ${renderJobId.slice(0, 8)} frame ${index}: ${outcome}`);
        const render = await RenderJob.findByPk(renderJobId, { attributes: ['status', 'framesDone', 'frameCount'] });
        if (render && render.status === 'done') await finalizeRender(renderJobId);
      } catch (error) {
        const message = error instanceof Error ? error.message : String(error);
        log(`[${workerName}] render ${renderJobId.slice(0, 8)} frame ${index} failed (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}): ${message}`);
        if (job.retryCount >= job.retryLimit) await failRender(renderJobId, index, message);
        throw error; // pg-boss retries the frame until its retry limit
      }
    }
  });
  log(`[${workerName}] waiting for frames (${threads} render threads)`);

  return {
    stop: async () => {
      await stopQueue();
      await pool.close();
      await sequelize.close();
    },
  };
}

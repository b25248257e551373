import 'server-only';
import os from 'node:os';
import type PgBoss from 'pg-boss';
import { env } from '@/lib/env';
import { createRenderPool, type RenderPool } from '@/lib/render/node/renderFrame';
import { queue, RENDER_FRAME_QUEUE, stopQueue, type RenderFrameJob } from '@/lib/queue/boss';
import { sequelize } from '@/models';
import { renderJobFrame, storeRenderedFrame, type RenderedFrame } from './process-frame';
import { finalizeRender, failRender } from './finalize';

/** How often an idle worker asks the queue for work, ms. */
const IDLE_POLL_MS = 500;

type FrameJob = PgBoss.JobWithMetadata<RenderFrameJob>;

/**
 * A render worker: takes one frame at a time from the PostgreSQL queue and
 * renders it on all local cores (or RENDER_THREADS). Run as many as you like,
 * on any machine that reaches the same database and object store.
 *
 * Frames are pipelined: while frame N renders on the worker threads, this
 * thread stores frame N-1 (S3 put, frame row, progress) and completes its
 * queue job, so the render threads do not wait on the network. A frame's
 * queue job is completed only after its row is recorded, so a worker that
 * dies loses at most the frame it was rendering and the one it was storing;
 * both come back to the queue when their jobs expire.
 */
export async function runWorker(workerName: string, log: (line: string) => void = console.log): Promise<{ stop: () => Promise<void> }> {
  const threads = env.RENDER_THREADS ?? os.availableParallelism();
  const pool: RenderPool = createRenderPool(threads);
  const boss = await queue();
  let stopping = false;
  // ends an idle wait early when the worker is stopped
  let wakeIdle = () => {};

  const describe = (job: FrameJob) => `render ${job.data.renderJobId.slice(0, 8)} frame ${job.data.index}`;

  /** Records a failed attempt; pg-boss retries the frame until its retry limit. */
  async function failed(job: FrameJob, error: unknown): Promise<void> {
    const message = error instanceof Error ? error.message : String(error);
    log(`[${workerName}] ${describe(job)} failed (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}): ${message}`);
    try {
      if (job.retryCount >= job.retryLimit) await failRender(job.data.renderJobId, job.data.index, message);
      await boss.fail(RENDER_FRAME_QUEUE, job.id, { message });
    } catch (inner) {
      // the job stays active and expires back into the queue
      log(`[${workerName}] ${describe(job)}: could not record the failure: ${inner instanceof Error ? inner.message : String(inner)}`);
    }
  }

  /** Stores a rendered frame, finalizes the render if it was the last, completes the queue job. */
  async function store(job: FrameJob, frame: RenderedFrame): Promise<void> {
    try {
      const { completed } = await storeRenderedFrame(frame, workerName);
      log(`[${workerName}] ${describe(job)}: rendered in ${frame.renderMs} ms`);
      if (completed) await finalizeRender(frame.renderJobId);
      await boss.complete(RENDER_FRAME_QUEUE, job.id);
    } catch (error) {
      await failed(job, error);
    }
  }

  async function loop(): Promise<void> {
    let storing: Promise<void> = Promise.resolve();
    while (!stopping) {
      let job: FrameJob | undefined;
      try {
        [job] = await boss.fetch<RenderFrameJob>(RENDER_FRAME_QUEUE, { batchSize: 1, includeMetadata: true });
      } catch (error) {
        log(`[${workerName}] could not fetch work: ${error instanceof Error ? error.message : String(error)}`);
      }
      if (!job) {
        await new Promise<void>((resolve) => {
          wakeIdle = resolve;
          setTimeout(resolve, IDLE_POLL_MS);
        });
        continue;
      }
      try {
        const rendered = await renderJobFrame(job.data.renderJobId, job.data.index, { pool });
        if (typeof rendered === 'string') {
          log(`[${workerName}] ${describe(job)}: ${rendered}`);
          await boss.complete(RENDER_FRAME_QUEUE, job.id);
        } else {
          // the previous frame's store ran during this render; one store at a time bounds memory
          await storing;
          storing = store(job, rendered);
        }
      } catch (error) {
        await failed(job, error);
      }
    }
    await storing;
  }

  const running = loop();
  log(`[${workerName}] waiting for frames (${threads} render threads)`);

  return {
    stop: async () => {
      stopping = true;
      wakeIdle();
      await running;
      await stopQueue();
      await pool.close();
      await sequelize.close();
    },
  };
}

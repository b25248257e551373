/**
 * A pool of render worker threads (Node only). Each frame is sent to every
 * worker once; the workers then share the frame's bands through an atomic
 * counter in shared memory (a work queue with no per-band messages from the
 * pool), so the load balances itself and nothing large is copied per band.
 * Frames on one pool run one after another. Workers load TypeScript through
 * tsx's loader (the project runs its scripts with tsx); they stay alive
 * between frames and do not keep the process alive while idle.
 */
import { Worker } from 'node:worker_threads';
import { renderWorkerBootstrapFile } from './paths';
import type { BandResult, FrameJob } from './frameJob';
import type { FromWorker, ToWorker } from './worker';

/** A pool of render worker threads. */
export interface RenderPool {
  /** number of worker threads */
  readonly threads: number;
  /** resolves once every worker has started (loaded its code), so timings can leave start-up out */
  ready(): Promise<void>;
  /**
   * Render every band of a frame job on the pool's workers.
   * @param job the frame (typed arrays in shared memory; its band counter at 0)
   * @param onBand called on this thread with each finished band, in completion order
   */
  renderJob(job: FrameJob, onBand: (result: BandResult) => void): Promise<void>;
  /** stop the workers */
  close(): Promise<void>;
}

interface Slot {
  worker: Worker;
  ready: Promise<void>;
  /** set when the worker died: replaced before the next frame */
  dead: boolean;
}

interface RunningFrame {
  jobId: number;
  pending: number;
  error: Error | null;
  onBand: (result: BandResult) => void;
  resolve: () => void;
  reject: (error: Error) => void;
}

/** Error from a worker's message, keeping RangeError (bad request) apart from other failures. */
function workerError(message: string): Error {
  const prefix = 'RangeError: ';
  return message.startsWith(prefix) ? new RangeError(message.slice(prefix.length)) : new Error(`render worker: ${message}`);
}

class WorkerPool implements RenderPool {
  private readonly slots: Slot[] = [];
  private running: RunningFrame | null = null;
  private queue: Promise<void> = Promise.resolve();
  private nextJobId = 1;
  private closed = false;

  constructor(readonly threads: number) {
    for (let i = 0; i < threads; i++) this.slots.push(this.spawn());
  }

  private spawn(): Slot {
    // the main module is a CommonJS bootstrap that requires worker.ts through tsx (workerBootstrap.cjs)
    const worker = new Worker(renderWorkerBootstrapFile(), { execArgv: ['--import', 'tsx'] });
    let markReady!: () => void;
    let failStart!: (error: Error) => void;
    const slot: Slot = { worker, dead: false, ready: new Promise<void>((res, rej) => ((markReady = res), (failStart = rej))) };
    slot.ready.catch(() => undefined); // a start failure is reported by the frame that waits for it
    worker.on('message', (message: FromWorker) => {
      if (message.type === 'ready') {
        // referenced while starting (so awaiting ready() keeps the process alive), then only during frames
        if (this.running === null) worker.unref();
        return markReady();
      }
      const frame = this.running;
      if (!frame || message.jobId !== frame.jobId) return;
      if (message.type === 'band') {
        try {
          frame.onBand(message.result);
        } catch (err) {
          frame.error ??= err instanceof Error ? err : new Error(String(err));
        }
        return;
      }
      if (message.error !== null) frame.error ??= workerError(message.error);
      this.finishOne(frame);
    });
    const die = (error: Error) => {
      if (slot.dead) return;
      slot.dead = true;
      failStart(error);
      const frame = this.running;
      if (frame) {
        frame.error ??= error;
        this.finishOne(frame);
      }
    };
    worker.on('error', (err) => die(err instanceof Error ? err : new Error(String(err))));
    worker.on('exit', (code) => die(new Error(`render worker exited with code ${code}`)));
    return slot;
  }

  private finishOne(frame: RunningFrame): void {
    frame.pending--;
    if (frame.pending > 0) return;
    this.running = null;
    for (const s of this.slots) s.worker.unref();
    if (frame.error) frame.reject(frame.error);
    else frame.resolve();
  }

  ready(): Promise<void> {
    return Promise.all(this.slots.map((s) => s.ready)).then(() => undefined);
  }

  renderJob(job: FrameJob, onBand: (result: BandResult) => void): Promise<void> {
    const run = async (): Promise<void> => {
      if (this.closed) throw new Error('render pool: closed');
      for (let i = 0; i < this.slots.length; i++) {
        if (this.slots[i].dead) this.slots[i] = this.spawn();
      }
      await this.ready();
      await new Promise<void>((resolve, reject) => {
        const jobId = this.nextJobId++;
        this.running = { jobId, pending: this.slots.length, error: null, onBand, resolve, reject };
        for (const s of this.slots) {
          s.worker.ref();
          s.worker.postMessage({ type: 'frame', jobId, job } satisfies ToWorker);
        }
      });
    };
    const result = this.queue.then(run, run);
    this.queue = result.catch(() => undefined);
    return result;
  }

  async close(): Promise<void> {
    this.closed = true;
    await this.queue;
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}

/**
 * Start a pool of render workers.
 * @param threads number of worker threads, 1..64
 * @returns the pool; close it when done (idle workers do not keep the process alive)
 */
export function createRenderPool(threads: number): RenderPool {
  if (!Number.isInteger(threads) || threads < 1 || threads > 64) throw new RangeError('threads: integer 1..64');
  return new WorkerPool(threads);
}

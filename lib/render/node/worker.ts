/**
 * Worker-thread entry of the render pool (Node only). A worker receives each
 * frame job once, then claims bands from the job's shared counter until none
 * is left, posting every finished band (its PNG piece, if any) back to the
 * pool; the frame plan is built once per frame per worker. Imports only the
 * pure core and the PNG helper, so workers start fast.
 */
import { parentPort } from 'node:worker_threads';
import { renderClaimedBands, type BandResult, type FrameJob } from './frameJob';

/** Messages from the pool to a worker. */
export type ToWorker = { type: 'frame'; jobId: number; job: FrameJob };

/** Messages from a worker to the pool. */
export type FromWorker =
  | { type: 'ready' }
  | { type: 'band'; jobId: number; result: BandResult }
  | { type: 'done'; jobId: number; error: string | null };

const port = parentPort;
if (port) {
  port.on('message', (message: ToWorker) => {
    if (message.type !== 'frame') return;
    const { jobId, job } = message;
    let error: string | null = null;
    try {
      renderClaimedBands(job, (result) => {
        // the piece's bytes are moved, not copied (each chunk owns its ArrayBuffer: png.ts pngChunk)
        const transfer = result.piece ? [result.piece.chunk.buffer as ArrayBuffer] : [];
        port.postMessage({ type: 'band', jobId, result } satisfies FromWorker, transfer);
      });
    } catch (err) {
      error = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
      // stop the other workers claiming bands of a frame that cannot finish
      Atomics.store(job.nextBand, 0, job.bandCount);
    }
    port.postMessage({ type: 'done', jobId, error } satisfies FromWorker);
  });
  port.postMessage({ type: 'ready' } satisfies FromWorker);
}

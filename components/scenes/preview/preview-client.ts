/**
 * Page side of the preview worker: one frame in flight, and only the newest
 * waiting request kept, so a fast scrub never queues stale frames.
 */
import type { FrameRequest } from '@/lib/render/schema';
import type { PreviewRenderReply } from './preview-protocol';

export type PreviewFrame = Extract<PreviewRenderReply, { ok: true }> & { request: FrameRequest };

export class PreviewClient {
  private readonly worker: Worker;
  private nextId = 1;
  private busy: { id: number; request: FrameRequest; done: (f: PreviewFrame | Error) => void } | null = null;
  private waiting: { request: FrameRequest; done: (f: PreviewFrame | Error) => void } | null = null;

  constructor(private readonly assetBase: string) {
    this.worker = new Worker(new URL('./preview.worker.ts', import.meta.url), { type: 'module' });
    this.worker.onmessage = (event: MessageEvent<PreviewRenderReply>) => {
      const job = this.busy;
      if (!job || job.id !== event.data.id) return;
      this.busy = null;
      job.done(event.data.ok ? { ...event.data, request: job.request } : new Error(event.data.error));
      this.pump();
    };
  }

  /** Queue a frame; `done` gets the frame or an error (never called for a request replaced while waiting). */
  render(request: FrameRequest, done: (f: PreviewFrame | Error) => void): void {
    this.waiting = { request, done };
    this.pump();
  }

  private pump(): void {
    if (this.busy || !this.waiting) return;
    const id = this.nextId++;
    this.busy = { id, ...this.waiting };
    this.waiting = null;
    this.worker.postMessage({ id, request: this.busy.request, assetBase: this.assetBase });
  }

  dispose(): void {
    this.worker.terminate();
  }
}

/**
 * Page side of the CPU render worker: one frame in flight at a time; a newer
 * request replaces one still waiting, so dragging never queues stale frames.
 */
import type { FrameRequest } from '@/lib/render/schema';
import type { SkyViewMode } from '../gpu/gpu-sky-renderer';
import type { CpuRenderMessage, CpuRenderReply } from './cpu-protocol';

/** A finished CPU frame. */
export interface CpuFrame {
  width: number;
  height: number;
  rgba: Uint8ClampedArray;
  renderMs: number;
  request: FrameRequest;
}

type Pending = { request: FrameRequest; mode: SkyViewMode; resolve: (f: CpuFrame | null) => void; reject: (e: Error) => void };

/** Drives one CPU render worker. */
export class CpuSkyClient {
  private readonly worker: Worker;
  private nextId = 1;
  private inFlight: (Pending & { id: number }) | null = null;
  private waiting: Pending | null = null;

  /**
   * @param createWorker makes the worker (the app: new Worker(new URL('./cpu-worker.ts', import.meta.url)))
   * @param assetBase absolute URL prefix of the sky-assets API
   */
  constructor(createWorker: () => Worker, private readonly assetBase: string) {
    this.worker = createWorker();
    this.worker.onmessage = (event: MessageEvent<CpuRenderReply>) => this.onReply(event.data);
  }

  /**
   * Render a frame; resolves null when a newer request superseded this one before it started.
   */
  render(request: FrameRequest, mode: SkyViewMode): Promise<CpuFrame | null> {
    return new Promise((resolve, reject) => {
      if (this.waiting) this.waiting.resolve(null);
      this.waiting = { request, mode, resolve, reject };
      this.pump();
    });
  }

  private pump(): void {
    if (this.inFlight || !this.waiting) return;
    const job = { ...this.waiting, id: this.nextId++ };
    this.waiting = null;
    this.inFlight = job;
    const message: CpuRenderMessage = { id: job.id, request: job.request, mode: job.mode, assetBase: this.assetBase };
    this.worker.postMessage(message);
  }

  private onReply(reply: CpuRenderReply): void {
    const job = this.inFlight;
    if (!job || job.id !== reply.id) return;
    this.inFlight = null;
    if (reply.ok) job.resolve({ width: reply.width, height: reply.height, rgba: reply.rgba, renderMs: reply.renderMs, request: job.request });
    else job.reject(new Error(reply.error));
    this.pump();
  }

  /** Stop the worker. */
  dispose(): void {
    this.worker.terminate();
    this.waiting?.resolve(null);
    this.inFlight?.resolve(null);
  }
}

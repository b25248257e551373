'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import { frameRequestAt, frameSizeFor } from '@/lib/scenes/frame-request';
import type { FrameRequest } from '@/lib/render/schema';
import type { LiveScene } from '../editor/use-live-scene';
import { PreviewClient, type PreviewFrame } from './preview-client';

/** Display box of the preview, px. Full detail renders at this size (1:1 on the canvas). */
export const PREVIEW_WIDTH = 640;
export const PREVIEW_HEIGHT = 360;
/** While scrubbing or typing the CPU renders at half size and the canvas scales it up. */
const INTERACTIVE_SCALE = 0.5;
/** How long the scrubber and fields must rest before the full-detail frame is rendered, ms. */
const REST_MS = 220;

type Detail = 'interactive' | 'full';

/** Frame request of the preview at a detail level (pure; also used by tests through the page's data attributes). */
function previewRequest(live: LiveScene, tau: number, detail: Detail): FrameRequest {
  const scale = detail === 'full' ? 1 : INTERACTIVE_SCALE;
  const size = frameSizeFor(live.spec.projection, Math.round(PREVIEW_WIDTH * scale), Math.round(PREVIEW_HEIGHT * scale));
  return frameRequestAt(live.spec, live.worldline, tau, size);
}

/**
 * The live preview: lib/render in a Web Worker, light frames while anything
 * moves, the full-detail frame once it rests. Never blocks typing: requests
 * are built from the last valid scene and only the newest waiting frame is kept.
 */
export function ScenePreview({ live, tau, scrubbing, stale }: { live: LiveScene | null; tau: number; scrubbing: boolean; stale: boolean }) {
  const canvas = useRef<HTMLCanvasElement | null>(null);
  const client = useRef<PreviewClient | null>(null);
  const [detail, setDetail] = useState<Detail>('full');
  const [status, setStatus] = useState<{ frame: Pick<PreviewFrame, 'width' | 'height' | 'renderMs' | 'skyMissing'> | null; error: string | null; fps: number | null; drawn: number }>({ frame: null, error: null, fps: null, drawn: 0 });
  const [lastRequest, setLastRequest] = useState<string>('');
  const frameTimes = useRef<number[]>([]);

  useEffect(() => {
    client.current = new PreviewClient(`${window.location.origin}/api/v1/sky-assets`);
    return () => client.current?.dispose();
  }, []);

  // Anything moving -> light frames; a short rest -> full detail.
  const version = live?.version ?? 0;
  useEffect(() => {
    setDetail('interactive');
    if (scrubbing) return;
    const timer = setTimeout(() => setDetail('full'), REST_MS);
    return () => clearTimeout(timer);
  }, [version, tau, scrubbing]);

  const request = useMemo(() => {
    if (!live) return null;
    try {
      return previewRequest(live, tau, detail);
    } catch (error) {
      return error instanceof Error ? error : new Error(String(error));
    }
  }, [live, tau, detail]);

  useEffect(() => {
    if (!request || request instanceof Error || !client.current) return;
    client.current.render(request, (frame) => {
      if (frame instanceof Error) {
        setStatus((s) => ({ ...s, error: frame.message }));
        return;
      }
      draw(canvas.current, frame);
      const now = performance.now();
      const times = frameTimes.current.filter((t) => now - t < 1000);
      times.push(now);
      frameTimes.current = times;
      setStatus((s) => ({ frame: { width: frame.width, height: frame.height, renderMs: frame.renderMs, skyMissing: frame.skyMissing }, error: null, fps: times.length > 1 ? times.length : null, drawn: s.drawn + 1 }));
      setLastRequest(JSON.stringify(frame.request));
    });
  }, [request]);

  const requestError = request instanceof Error ? request.message : null;
  const drawnDetail = status.frame ? (status.frame.width === PREVIEW_WIDTH || status.frame.height === PREVIEW_HEIGHT ? 'full' : 'interactive') : 'none';
  return (
    <div className="space-y-1">
      <div className="relative overflow-hidden rounded-md border border-ink-700 bg-black">
        <canvas
          ref={canvas}
          width={PREVIEW_WIDTH}
          height={PREVIEW_HEIGHT}
          className={`block aspect-video w-full ${stale ? 'opacity-60' : ''}`}
          data-testid="preview-canvas"
          aria-label="Live preview of the camera's view"
          role="img"
        />
        <div
          className="sr-only"
          data-testid="preview"
          data-detail={drawnDetail}
          data-frames={status.drawn}
          data-request={lastRequest}
          data-fps={status.fps ?? ''}
          data-sky-missing={status.frame?.skyMissing ? 'true' : 'false'}
        />
        {stale ? <p className="absolute left-2 top-2 rounded bg-ink-950/80 px-2 py-0.5 text-xs text-violet-300">Showing the last valid version</p> : null}
      </div>
      <p className="flex flex-wrap justify-between gap-2 text-[11px] text-slate-500" data-testid="preview-status">
        <span>
          CPU preview (lib/render in a worker) · {status.frame ? `${status.frame.width}×${status.frame.height}, ${Math.round(status.frame.renderMs)} ms` : 'rendering…'}
          {drawnDetail === 'interactive' ? ' · light frame while moving' : ''}
          {status.fps && drawnDetail === 'interactive' ? ` · ${status.fps} fps` : ''}
        </span>
        {status.frame?.skyMissing ? <span className="text-violet-300">Star and Milky Way data could not be loaded: grids and shadow only.</span> : null}
        {requestError || status.error ? <span className="text-danger-400">{requestError ?? status.error}</span> : null}
      </p>
    </div>
  );
}

const scratch: { canvas: OffscreenCanvas | HTMLCanvasElement | null } = { canvas: null };

/** Draw a frame centred in the display canvas: 1:1 at full detail, scaled up for light frames. */
function draw(target: HTMLCanvasElement | null, frame: PreviewFrame): void {
  const ctx = target?.getContext('2d');
  if (!target || !ctx) return;
  const image = new ImageData(new Uint8ClampedArray(frame.rgba), frame.width, frame.height);
  const scale = Math.min(target.width / frame.width, target.height / frame.height);
  const w = Math.round(frame.width * scale);
  const h = Math.round(frame.height * scale);
  const x = Math.floor((target.width - w) / 2);
  const y = Math.floor((target.height - h) / 2);
  ctx.fillStyle = '#000';
  ctx.fillRect(0, 0, target.width, target.height);
  if (scale === 1) {
    ctx.putImageData(image, x, y);
  } else {
    if (!scratch.canvas) scratch.canvas = typeof OffscreenCanvas !== 'undefined' ? new OffscreenCanvas(1, 1) : document.createElement('canvas');
    const off = scratch.canvas;
    off.width = frame.width;
    off.height = frame.height;
    (off.getContext('2d') as CanvasRenderingContext2D | OffscreenCanvasRenderingContext2D).putImageData(image, 0, 0);
    ctx.imageSmoothingEnabled = true;
    ctx.drawImage(off as CanvasImageSource, x, y, w, h);
  }
  target.dataset.frameX = String(x);
  target.dataset.frameY = String(y);
  target.dataset.frameWidth = String(w);
  target.dataset.frameHeight = String(h);
}

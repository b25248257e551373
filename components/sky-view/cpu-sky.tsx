'use client';
/**
 * The CPU path: lib/render in a Web Worker (cpu/cpu-worker.ts), each finished
 * frame painted into a 2-D canvas of the request's size.
 */
import { useEffect, useRef, useState } from 'react';
import type { FrameRequest } from '@/lib/render/schema';
import type { SkyViewMode } from './gpu/gpu-sky-renderer';
import { CpuSkyClient, type CpuFrame } from './cpu/cpu-client';
import { countFrameShown, publishDebugHandle, toBase64 } from './debug-handle';

interface CpuSkyProps {
  request: FrameRequest;
  mode: SkyViewMode;
  assetBase: string;
  /** width to show frames at, px (default: the request's); the canvas scales whatever size it last drew */
  displayWidth?: number;
}

/** The lensed sky rendered by lib/render in a worker. */
export function CpuSky({ request, mode, assetBase, displayWidth }: CpuSkyProps) {
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const clientRef = useRef<CpuSkyClient | null>(null);
  const [last, setLast] = useState<CpuFrame | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    const absolute = new URL(assetBase, window.location.href).href;
    const client = new CpuSkyClient(() => new Worker(new URL('./cpu/cpu-worker.ts', import.meta.url), { type: 'module' }), absolute);
    clientRef.current = client;
    return () => {
      client.dispose();
      clientRef.current = null;
    };
  }, [assetBase]);

  // effects key on the request's content: a parent may build an equal request object on every render
  const requestKey = JSON.stringify(request);
  useEffect(() => {
    const client = clientRef.current;
    if (!client) return;
    setBusy(true);
    client.render(request, mode).then(
      (frame) => {
        if (!frame) return;
        setBusy(false);
        setError(null);
        setLast(frame);
        const canvas = canvasRef.current;
        const ctx = canvas?.getContext('2d');
        if (canvas && ctx) {
          canvas.width = frame.width;
          canvas.height = frame.height;
          ctx.putImageData(new ImageData(new Uint8ClampedArray(frame.rgba), frame.width, frame.height), 0, 0);
          countFrameShown();
        }
      },
      (e: unknown) => {
        setBusy(false);
        setError(e instanceof Error ? e.message : String(e));
      },
    );
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [requestKey, mode]);

  useEffect(
    () =>
      publishDebugHandle({
        path: 'cpu',
        request: last?.request ?? null,
        readFrame: async () => (last ? toBase64(last.rgba) : ''),
      }),
    [last],
  );

  return (
    <div style={{ width: displayWidth ?? request.width }} className="relative" data-testid="sky-view-cpu" data-ready={last && !busy ? 'true' : 'false'}>
      <canvas ref={canvasRef} width={request.width} height={request.height} className="block h-auto w-full" aria-label="Lensed sky, rendered on the CPU" />
      {busy && <p className="absolute left-2 top-2 rounded bg-ink-950/80 px-2 py-1 text-xs text-slate-300">Rendering on the CPU…</p>}
      {error && (
        <p role="alert" className="absolute inset-x-2 top-2 rounded bg-ink-950/90 px-2 py-1 text-xs text-danger-400">
          CPU render failed: {error}
        </p>
      )}
      {last && <span className="sr-only">Last CPU frame took {Math.round(last.renderMs)} ms</span>}
    </div>
  );
}

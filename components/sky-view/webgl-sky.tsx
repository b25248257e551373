'use client';
/**
 * The WebGL path: a @react-three/fiber canvas that draws at the request's size
 * (shown scaled to the display width) and whose render pass (GpuSkyRenderer)
 * draws shaders/sky.lensed.frag. Frames are
 * drawn on demand, when the request, mode or sky data change.
 */
import { useEffect, useMemo, useState } from 'react';
import { Canvas, useFrame, useThree } from '@react-three/fiber';
import type { FrameRequest } from '@/lib/render/schema';
import { GpuSkyRenderer, type SkyViewMode } from './gpu/gpu-sky-renderer';
import type { GpuSkyData } from './gpu/sky-data';
import { cachedGpuSkyData, loadGpuSkyData } from './gpu/sky-data-client';
import { countFrameShown, publishDebugHandle, toBase64 } from './debug-handle';
import { WebGlFailureBoundary } from './webgl-failure-boundary';

/** How long a changed magnitude limit must rest before its sky data is built, ms. */
const LIMIT_REST_MS = 300;

interface WebGlSkyProps {
  request: FrameRequest;
  mode: SkyViewMode;
  assetBase: string;
  /** called when the context is lost or the sky data cannot be loaded */
  onFailure: (reason: string) => void;
  onFrame?: (info: { tableBuildMs: number }) => void;
  /** width to show the frame at, px; the frame is scaled to it by a CSS transform, which leaves its drawing size alone */
  displayWidth?: number;
}

function SkyPass({ request, mode, sky, onFrame }: { request: FrameRequest; mode: SkyViewMode; sky: GpuSkyData; onFrame?: WebGlSkyProps['onFrame'] }) {
  const gl = useThree((s) => s.gl);
  const invalidate = useThree((s) => s.invalidate);
  const renderer = useMemo(() => new GpuSkyRenderer(gl), [gl]);
  useEffect(() => () => renderer.dispose(), [renderer]);
  useEffect(() => {
    renderer.setSky(sky);
    invalidate();
  }, [renderer, sky, invalidate]);
  useEffect(() => invalidate(), [request, mode, invalidate]);
  useEffect(
    () =>
      publishDebugHandle({
        path: 'webgl',
        request,
        readFrame: async () => toBase64(renderer.readFrame(request, mode)),
        readDirections: async () => toBase64(renderer.readDirections(request)),
      }),
    [renderer, request, mode],
  );
  // priority 1: this pass replaces r3f's own scene render
  useFrame((state) => {
    // a request of a new size waits for r3f to resize the canvas (it invalidates again when it has)
    if (state.size.width !== request.width || state.size.height !== request.height) return;
    const tableBuildMs = renderer.prepare(request, mode);
    renderer.draw();
    countFrameShown();
    onFrame?.({ tableBuildMs });
  }, 1);
  return null;
}

/** The lensed sky drawn by the GPU. */
export function WebGlSky({ request, mode, assetBase, onFailure, onFrame, displayWidth }: WebGlSkyProps) {
  const [sky, setSky] = useState<GpuSkyData | null>(null);
  const limit = request.sky.stars.magnitudeLimit;
  const hasSky = sky !== null;
  useEffect(() => {
    let live = true;
    const cached = cachedGpuSkyData(assetBase, limit);
    if (cached) {
      setSky(cached);
      return;
    }
    // The star tiles take ~1 s to build (in a worker): while a magnitude limit is being typed, wait until
    // it rests (the old sky stays on screen, marked not ready).
    const timer = setTimeout(
      () =>
        loadGpuSkyData(assetBase, limit).then(
          (built) => live && setSky(built),
          (error: unknown) => live && onFailure(`sky data could not be loaded (${error instanceof Error ? error.message : String(error)})`),
        ),
      hasSky ? LIMIT_REST_MS : 0,
    );
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [assetBase, limit, onFailure, hasSky]);
  // The canvas keeps the request's size and a transform scales it to the display width: r3f sizes its drawing
  // buffer from the box's offset size (resize.offsetSize), which a transform leaves alone.
  const scale = displayWidth && displayWidth > 0 ? displayWidth / request.width : 1;
  return (
    <div style={{ width: request.width * scale, height: request.height * scale, overflow: 'hidden' }} data-testid="sky-view-webgl" data-ready={sky && sky.magnitudeLimit === limit ? 'true' : 'false'}>
      <div style={{ width: request.width, height: request.height, transform: scale === 1 ? undefined : `scale(${scale})`, transformOrigin: '0 0' }}>
        {sky ? (
          <WebGlFailureBoundary onFailure={onFailure}>
            <Canvas
              frameloop="demand"
              dpr={1}
              flat
              linear
              resize={{ offsetSize: true }}
              gl={{ antialias: false, alpha: false, preserveDrawingBuffer: true, powerPreference: 'high-performance' }}
              onCreated={({ gl }) => {
                gl.domElement.addEventListener('webglcontextlost', (event) => {
                  event.preventDefault();
                  onFailure('the WebGL context was lost');
                });
              }}
            >
              <SkyPass request={request} mode={mode} sky={sky} onFrame={onFrame} />
            </Canvas>
          </WebGlFailureBoundary>
        ) : (
          <p className="p-4 text-sm text-slate-400">Loading sky data…</p>
        )}
      </div>
    </div>
  );
}

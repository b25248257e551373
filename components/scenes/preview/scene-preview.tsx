'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import { frameRequestAt, frameSizeFor } from '@/lib/scenes/frame-request';
import type { FrameRequest } from '@/lib/render/schema';
import { SkyView, type SkyViewPath } from '@/components/sky-view/sky-view';
import type { LiveScene } from '../editor/use-live-scene';
import { useElementWidth } from '@/components/ui/use-element-width';
import { useFullFramesChoice, useSlowWebGl } from './light-frames';

/** Display box of the preview, px: full detail renders at this size, shown 1:1 where the column is wide enough. */
export const PREVIEW_WIDTH = 640;
export const PREVIEW_HEIGHT = 360;
/**
 * Light frames: while scrubbing, playing or typing, the CPU fallback always, and WebGL when it has drawn
 * slowly in motion (light-frames.ts), render at this fraction of full size and
 * are scaled up; the full-detail frame follows when everything rests.
 */
const INTERACTIVE_SCALE = 0.5;
/** How long the scrubber and fields must rest before light frames give way to the full-detail frame, ms. */
const REST_MS = 220;

type Detail = 'interactive' | 'full';

/** Frame request of the preview at a detail level. */
function previewRequest(live: LiveScene, tau: number, detail: Detail): FrameRequest {
  const scale = detail === 'full' ? 1 : INTERACTIVE_SCALE;
  const size = frameSizeFor(live.spec.projection, Math.round(PREVIEW_WIDTH * scale), Math.round(PREVIEW_HEIGHT * scale));
  return frameRequestAt(live.spec, live.worldline, tau, size);
}

/** True from any change of the scene or scrub position until both have rested for REST_MS. */
function useMoving(version: number, tau: number, scrubbing: boolean): boolean {
  const [moving, setMoving] = useState(false);
  const first = useRef(true);
  useEffect(() => {
    // the first frame of a freshly opened scene is the full-detail one
    if (first.current) {
      first.current = false;
      return;
    }
    setMoving(true);
    if (scrubbing) return;
    const timer = setTimeout(() => setMoving(false), REST_MS);
    return () => clearTimeout(timer);
  }, [version, tau, scrubbing]);
  return moving;
}

/**
 * The live preview: the shared sky view (WebGL, or lib/render in a worker when
 * WebGL2 is missing or lost). While anything moves, the CPU fallback draws
 * half-size frames, and so does WebGL once it has proved slower than 20 frames
 * per second in motion (unless the producer asks for full-size frames); the
 * full-detail frame follows once the scrubber and fields rest. Never blocks
 * typing: requests come from the last valid scene, and the CPU worker keeps
 * only the newest waiting frame.
 */
export function ScenePreview({ live, tau, scrubbing, stale }: { live: LiveScene | null; tau: number; scrubbing: boolean; stale: boolean }) {
  const [path, setPath] = useState<SkyViewPath>({ kind: 'detecting' });
  const moving = useMoving(live?.version ?? 0, tau, scrubbing);
  const webgl = useSlowWebGl(scrubbing && path.kind === 'webgl');
  const [fullFrames, setFullFrames] = useFullFramesChoice();
  const light = path.kind === 'cpu' || (path.kind === 'webgl' && webgl.slow && !fullFrames);
  const detail: Detail = light && moving ? 'interactive' : 'full';

  const built = useMemo(() => {
    if (!live) return null;
    try {
      return previewRequest(live, tau, detail);
    } catch (error) {
      return error instanceof Error ? error : new Error(String(error));
    }
  }, [live, tau, detail]);
  // A request that cannot be built (e.g. a radius the observer cannot have) keeps the last good picture
  // (state from the previous render, the pattern React documents for derived state).
  const [lastGood, setLastGood] = useState<FrameRequest | null>(null);
  const fresh = built && !(built instanceof Error) ? built : null;
  if (fresh && fresh !== lastGood) setLastGood(fresh);
  const request = fresh ?? lastGood;
  // light frames are scaled up to this box; in a column narrower than the frame, every frame is scaled down to it
  const fullWidth = live ? frameSizeFor(live.spec.projection, PREVIEW_WIDTH, PREVIEW_HEIGHT).width : PREVIEW_WIDTH;
  const columnRef = useRef<HTMLDivElement>(null);
  const columnWidth = useElementWidth(columnRef);
  const shownWidth = columnWidth ? Math.min(fullWidth, Math.floor(columnWidth)) : fullWidth;
  const requestError = built instanceof Error ? built.message : null;
  const requestJson = useMemo(() => (request ? JSON.stringify(request) : ''), [request]);

  return (
    <div className="min-w-0 space-y-1" ref={columnRef}>
      <div
        className={`relative max-w-full ${stale ? 'opacity-60' : ''}`}
        style={{ width: shownWidth }}
        aria-label="Live preview of the camera's view"
        role="group"
      >
        {request ? (
          <SkyView request={request} onPathChange={setPath} onFrame={webgl.onFrame} displayWidth={shownWidth} />
        ) : (
          <div className="flex aspect-video w-full items-center justify-center rounded-md border border-ink-700 bg-black text-xs text-slate-500">No valid scene to preview yet.</div>
        )}
        <div className="sr-only" data-testid="preview" data-detail={request ? detail : 'none'} data-path={path.kind} data-request={requestJson} />
        {stale ? <p className="absolute left-2 top-2 rounded bg-ink-950/80 px-2 py-0.5 text-xs text-violet-300">Showing the last valid version</p> : null}
      </div>
      <p className="flex flex-wrap justify-between gap-2 text-[11px] text-slate-500" data-testid="preview-status">
        <span>
          {request ? `${request.width}×${request.height}` : 'no frame'}
          {detail === 'interactive' ? ` · light frame while moving (${path.kind === 'cpu' ? 'CPU fallback' : 'this browser draws WebGL below 20 frames per second'})` : ''}
        </span>
        {requestError ? <span className="text-danger-400">{requestError}</span> : null}
        {path.kind === 'webgl' && webgl.slow ? (
          <label className="flex items-center gap-1.5">
            <input type="checkbox" data-testid="preview-full-frames" checked={fullFrames} onChange={(e) => setFullFrames(e.target.checked)} className="accent-teal-400" />
            full-size frames while moving
          </label>
        ) : null}
      </p>
    </div>
  );
}

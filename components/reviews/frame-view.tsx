'use client';

import { useEffect, useState, type MouseEvent } from 'react';

export type FramePoint = { x: number; y: number };

/**
 * A server-rendered frame with an optional picked point (0..1 across and down
 * the frame). Clicking picks a point when `onPick` is given; the previous
 * frame stays visible, dimmed, while the next one renders.
 */
export function FrameView({ src, alt, width, height, point, onPick, testId }: { src: string; alt: string; width: number; height: number; point: FramePoint | null; onPick?: (point: FramePoint) => void; testId: string }) {
  const [loaded, setLoaded] = useState<string | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  useEffect(() => setFailed(null), [src]);
  const pick = (event: MouseEvent<HTMLDivElement>) => {
    if (!onPick) return;
    const box = event.currentTarget.getBoundingClientRect();
    const clamp = (v: number) => Math.min(1, Math.max(0, v));
    onPick({ x: clamp((event.clientX - box.left) / box.width), y: clamp((event.clientY - box.top) / box.height) });
  };
  return (
    <div className={`relative overflow-hidden rounded-md border border-ink-700 bg-black ${onPick ? 'cursor-crosshair' : ''}`} style={{ aspectRatio: `${width} / ${height}` }} onClick={pick} data-testid={`${testId}-box`}>
      {/* eslint-disable-next-line @next/next/no-img-element -- a PNG streamed by our own route, sized by the request */}
      <img
        src={src}
        alt={alt}
        width={width}
        height={height}
        className={`h-full w-full select-none object-contain transition-opacity ${loaded === src ? 'opacity-100' : 'opacity-60'}`}
        draggable={false}
        data-testid={testId}
        data-loaded={loaded === src ? 'true' : 'false'}
        onLoad={() => setLoaded(src)}
        onError={() => setFailed(src)}
      />
      {loaded !== src && failed !== src ? <span className="absolute right-2 top-2 rounded bg-ink-950/80 px-2 py-0.5 text-[11px] text-slate-300">rendering…</span> : null}
      {failed === src ? <span className="absolute inset-x-2 top-2 rounded bg-ink-950/90 px-2 py-1 text-xs text-danger-400" role="alert">This frame could not be rendered.</span> : null}
      {point ? (
        <span
          aria-hidden
          data-testid={`${testId}-point`}
          className="pointer-events-none absolute h-5 w-5 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-violet-300 shadow-[0_0_0_2px_rgba(5,7,12,0.8)]"
          style={{ left: `${point.x * 100}%`, top: `${point.y * 100}%` }}
        />
      ) : null}
    </div>
  );
}

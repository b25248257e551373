'use client';

import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { formatBytes, formatNumber } from './format';
import { frameUrl, type StoredFrame } from './types';

/** Thumbnails shown before "Show more": enough to scan a short sequence without loading hundreds of previews at once. */
const PAGE_SIZE = 60;

function FrameViewer({ studio, renderId, frame, onClose }: { studio: string; renderId: string; frame: StoredFrame; onClose: () => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = dialog.current;
    // No close() on cleanup: React's dev double-mount would fire onClose and shut the viewer at once; unmounting removes it anyway.
    if (d && !d.open) d.showModal();
  }, []);
  const r = frame.readout;
  const src = frameUrl(studio, renderId, frame.index);
  return (
    <dialog
      ref={dialog}
      onClose={onClose}
      onClick={(e) => { if (e.target === dialog.current) onClose(); }}
      aria-labelledby="frame-viewer-title"
      data-testid="frame-viewer"
      className="m-auto max-h-[95vh] w-[min(95vw,1100px)] rounded-lg border border-ink-700 bg-ink-900 p-0 text-slate-200 backdrop:bg-black/80"
    >
      <div className="flex items-center justify-between border-b border-ink-700 px-4 py-2">
        <h2 id="frame-viewer-title" className="text-sm font-semibold">Frame {frame.index}</h2>
        <div className="flex items-center gap-3 text-sm">
          <a href={src} target="_blank" rel="noreferrer" className="text-teal-300 hover:underline">Open original</a>
          <Button variant="secondary" onClick={onClose} autoFocus>Close</Button>
        </div>
      </div>
      <div className="grid gap-4 p-4 md:grid-cols-[1fr_15rem]">
        {/* eslint-disable-next-line @next/next/no-img-element -- a stored frame at its own size, not an optimisable asset */}
        <img src={src} alt={`Frame ${frame.index} at full resolution`} data-testid="frame-viewer-image" className="mx-auto max-h-[78vh] w-full bg-black object-contain" />
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 self-start text-xs tabular-nums">
          <dt className="text-slate-500">Proper time</dt><dd>{formatNumber(r.properTimeSeconds)} s</dd>
          <dt className="text-slate-500">Radius</dt><dd>{formatNumber(r.radiusRs)} r_s · {formatNumber(r.radiusKm)} km</dd>
          <dt className="text-slate-500">Speed vs hover</dt><dd>{r.speedRelativeToHover === null ? '–' : `${formatNumber(r.speedRelativeToHover, 3)} c`}</dd>
          <dt className="text-slate-500">Shift range</dt><dd>{formatNumber(r.shiftMin, 3)} – {formatNumber(r.shiftMax, 3)}</dd>
          <dt className="text-slate-500">Countdown</dt><dd>{r.countdownSeconds === null ? '–' : `${formatNumber(r.countdownSeconds)} s`}</dd>
          <dt className="text-slate-500">Exposure</dt><dd>{formatNumber(r.exposureEv, 3)} EV</dd>
          <dt className="text-slate-500">Size</dt><dd>{formatBytes(frame.bytes)}</dd>
          <dt className="text-slate-500">Rendered</dt><dd>{(frame.renderMs / 1000).toFixed(1)} s on {frame.worker}</dd>
          <dt className="text-slate-500">SHA-256</dt><dd className="break-all font-mono text-[10px] text-slate-400">{frame.sha256}</dd>
        </dl>
      </div>
    </dialog>
  );
}

/** Finished frames as thumbnails; a click (or Enter) opens the full frame with its readouts. */
export function FrameGrid({ studio, renderId, frames }: { studio: string; renderId: string; frames: StoredFrame[] }) {
  const [shown, setShown] = useState(PAGE_SIZE);
  const [open, setOpen] = useState<number | null>(null);
  const opened = frames.find((f) => f.index === open) ?? null;
  if (frames.length === 0) return <p className="text-sm text-slate-400" data-testid="no-frames">No frames finished yet. They appear here as workers store them.</p>;
  return (
    <div className="space-y-3">
      <ul className="grid grid-cols-[repeat(auto-fill,minmax(7.5rem,1fr))] gap-2" data-testid="frame-grid">
        {frames.slice(0, shown).map((f) => (
          <li key={f.index}>
            <button
              type="button"
              onClick={() => setOpen(f.index)}
              data-testid={`frame-thumb-${f.index}`}
              className="group block w-full overflow-hidden rounded-md border border-ink-700 bg-black text-left hover:border-teal-400 focus-visible:border-teal-400"
              aria-label={`Open frame ${f.index}`}
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- server-made 256 px preview */}
              <img src={frameUrl(studio, renderId, f.index, 'thumb')} alt="" loading="lazy" className="aspect-square w-full object-contain" />
              <span className="block bg-ink-950/80 px-2 py-0.5 text-[11px] tabular-nums text-slate-400 group-hover:text-teal-300">#{f.index} · {formatNumber(f.readout.radiusRs, 3)} r_s</span>
            </button>
          </li>
        ))}
      </ul>
      {frames.length > shown ? <Button variant="secondary" onClick={() => setShown((n) => n + PAGE_SIZE)}>Show {Math.min(PAGE_SIZE, frames.length - shown)} more of {frames.length - shown}</Button> : null}
      {opened ? <FrameViewer studio={studio} renderId={renderId} frame={opened} onClose={() => setOpen(null)} /> : null}
    </div>
  );
}

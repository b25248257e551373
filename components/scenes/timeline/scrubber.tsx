'use client';

import { useEffect, useRef, useState } from 'react';
import { formatDuration, formatScreenTime } from '../editor/format';

const STEPS = 1000;

/**
 * The timeline scrubber under the preview: screen time of the shot, with play,
 * keyboard steps (arrows, Page Up/Down, Home/End) and the proper time shown.
 * `onScrubbing` reports when the producer is actively moving it, so the
 * preview can stay light until the scrubber rests.
 */
export function Scrubber({
  start,
  end,
  value,
  tauSeconds,
  onChange,
  onScrubbing,
}: {
  start: number;
  end: number;
  value: number;
  tauSeconds: number | null;
  onChange: (screenTime: number) => void;
  onScrubbing: (active: boolean) => void;
}) {
  const [playing, setPlaying] = useState(false);
  const rest = useRef<ReturnType<typeof setTimeout> | null>(null);
  const span = Math.max(end - start, 1e-9);
  const position = Math.round(((value - start) / span) * STEPS);

  const moved = () => {
    onScrubbing(true);
    if (rest.current) clearTimeout(rest.current);
    rest.current = setTimeout(() => onScrubbing(false), 250);
  };

  const valueRef = useRef(value);
  valueRef.current = value;
  useEffect(() => {
    if (!playing) return;
    let last = performance.now();
    let frame = requestAnimationFrame(function tick(now) {
      const next = valueRef.current + (now - last) / 1000;
      last = now;
      if (next >= end) {
        onChange(end);
        setPlaying(false);
        onScrubbing(false);
        return;
      }
      onChange(next);
      frame = requestAnimationFrame(tick);
    });
    onScrubbing(true);
    return () => {
      cancelAnimationFrame(frame);
      onScrubbing(false);
    };
  }, [playing, end, onChange, onScrubbing]);

  return (
    <div className="flex items-center gap-3" data-testid="timeline">
      <button
        type="button"
        onClick={() => {
          if (!playing && value >= end) onChange(start);
          setPlaying((p) => !p);
        }}
        className="w-16 rounded-md border border-slate-600 px-2 py-1 text-xs text-slate-200 hover:border-teal-400 hover:text-teal-300"
        aria-label={playing ? 'Pause' : 'Play the shot'}
        data-testid="play"
      >
        {playing ? 'Pause' : 'Play'}
      </button>
      <input
        type="range"
        min={0}
        max={STEPS}
        step={1}
        value={Number.isFinite(position) ? position : 0}
        aria-label="Screen time"
        aria-valuetext={`${formatScreenTime(value)} of ${formatScreenTime(end)}`}
        data-testid="scrubber"
        className="h-2 flex-1 cursor-pointer accent-violet-400"
        onPointerDown={() => onScrubbing(true)}
        onPointerUp={moved}
        onChange={(e) => {
          moved();
          onChange(start + (Number(e.target.value) / STEPS) * span);
        }}
      />
      <div className="w-40 text-right text-xs tabular-nums leading-tight">
        <p className="text-slate-200" data-testid="screen-time">{formatScreenTime(value)} / {formatScreenTime(end)}</p>
        <p className="text-slate-500">proper time {tauSeconds === null ? '–' : formatDuration(tauSeconds)}</p>
      </div>
    </div>
  );
}

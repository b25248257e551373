'use client';

import { useMemo, useRef, useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import type { SceneSpecInput } from '@/lib/scenes/schema';
import { FRAME_RATES } from '@/lib/scenes/schema';
import { buildPacingCurve, screenTimeAt, slowDownNearEnd, type PacingPoint } from '@/lib/scenes/pacing';
import { useEditor, usePlayhead } from '../editor/editor-context';
import { formatDuration, formatNumber } from '../editor/format';

const W = 640;
const H = 170;
const PAD = { left: 46, right: 12, top: 10, bottom: 26 };

/**
 * The pacing curve: screen time against the traveller's proper time, edited
 * with handles (drag, or focus a handle and use the arrow keys; double-click
 * to add one, Delete to remove it).
 */
export function PacingEditor() {
  const { canEdit, live, secondsPerM, issues } = useEditor();
  const { tau } = usePlayhead();
  const { control, setValue } = useFormContext<SceneSpecInput>();
  const points = (useWatch({ control, name: 'pacing.points' }) ?? []) as PacingPoint[];
  const frameRate = useWatch({ control, name: 'pacing.frameRate' }) as number;
  const svg = useRef<SVGSVGElement | null>(null);
  const [selected, setSelected] = useState<number | null>(null);
  const pathDuration = live?.worldline.duration ?? points[points.length - 1]?.properTime ?? 1;

  const curve = useMemo(() => {
    try {
      return buildPacingCurve(points);
    } catch {
      return null;
    }
  }, [points]);
  const xMax = Math.max(pathDuration, ...points.map((p) => p.properTime)) || 1;
  const screenEnd = curve ? screenTimeAt(curve, pathDuration) : (points[points.length - 1]?.screenTime ?? 1);
  const yMax = Math.max(screenEnd, ...points.map((p) => p.screenTime)) * 1.05 || 1;
  const sx = (t: number) => PAD.left + (t / xMax) * (W - PAD.left - PAD.right);
  const sy = (s: number) => H - PAD.bottom - (s / yMax) * (H - PAD.top - PAD.bottom);
  const fromPx = (px: number, py: number) => ({
    properTime: ((px - PAD.left) / (W - PAD.left - PAD.right)) * xMax,
    screenTime: ((H - PAD.bottom - py) / (H - PAD.top - PAD.bottom)) * yMax,
  });
  const toSvg = (clientX: number, clientY: number) => {
    const rect = svg.current!.getBoundingClientRect();
    return { x: ((clientX - rect.left) / rect.width) * W, y: ((clientY - rect.top) / rect.height) * H };
  };

  const write = (next: PacingPoint[]) => setValue('pacing.points', next, { shouldDirty: true });
  /** Move handle i, kept strictly between its neighbours so the curve stays monotone. */
  const moveHandle = (i: number, target: PacingPoint) => {
    const gapT = xMax * 1e-4;
    const gapS = yMax * 1e-4;
    const lo = points[i - 1];
    const hi = points[i + 1];
    const properTime = Math.min(hi ? hi.properTime - gapT : Infinity, Math.max(lo ? lo.properTime + gapT : 0, target.properTime));
    const screenTime = Math.min(hi ? hi.screenTime - gapS : Infinity, Math.max(lo ? lo.screenTime + gapS : 0, target.screenTime));
    write(points.map((p, k) => (k === i ? { properTime: Number(properTime.toPrecision(9)), screenTime: Number(screenTime.toPrecision(9)) } : p)));
  };

  const curvePath = useMemo(() => {
    if (!curve) return '';
    const parts: string[] = [];
    for (let i = 0; i <= 200; i++) {
      const t = (xMax * i) / 200;
      parts.push(`${i === 0 ? 'M' : 'L'}${sx(t).toFixed(1)},${sy(Math.max(0, screenTimeAt(curve, t))).toFixed(1)}`);
    }
    return parts.join(' ');
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [curve, xMax, yMax]);

  const total = screenEnd;
  return (
    <div className="space-y-2" data-testid="pacing-editor">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-xs text-slate-300">
          <span className="font-medium">Pacing curve</span>
          <span className="text-slate-500"> · screen time against proper time · shot length {formatNumber(total, 3)} s = {Math.round(total * (frameRate || 30))} frames</span>
        </p>
        {canEdit ? (
          <div className="flex flex-wrap items-center gap-2 text-xs">
            <button type="button" className="rounded border border-slate-600 px-2 py-0.5 text-slate-300 hover:border-teal-400" onClick={() => write([{ properTime: 0, screenTime: 0 }, { properTime: pathDuration, screenTime: Math.max(1, Number(total.toPrecision(4))) }])}>
              Even pace
            </button>
            <button type="button" data-testid="pacing-slow-end" className="rounded border border-slate-600 px-2 py-0.5 text-slate-300 hover:border-teal-400" onClick={() => write(slowDownNearEnd(pathDuration, Math.max(1, Number(total.toPrecision(4)))))}>
              Slow down near the end
            </button>
            <label className="flex items-center gap-1 text-slate-400">
              fps
              <select value={frameRate} onChange={(e) => setValue('pacing.frameRate', Number(e.target.value), { shouldDirty: true })} className="rounded border border-slate-600 bg-ink-900 px-1 py-0.5 text-slate-200">
                {FRAME_RATES.map((r) => <option key={r} value={r}>{r}</option>)}
              </select>
            </label>
          </div>
        ) : null}
      </div>
      <svg
        ref={svg}
        viewBox={`0 0 ${W} ${H}`}
        className="w-full select-none rounded-md border border-ink-700 bg-ink-950/60"
        role="group"
        aria-label="Pacing curve editor"
        onDoubleClick={(e) => {
          if (!canEdit) return;
          const p = toSvg(e.clientX, e.clientY);
          const at = fromPx(p.x, p.y);
          const i = points.findIndex((q) => q.properTime > at.properTime);
          if (i <= 0) return;
          const next = [...points.slice(0, i), at, ...points.slice(i)];
          if (next[i - 1].screenTime < at.screenTime && at.screenTime < next[i + 1].screenTime) write(next);
        }}
      >
        <line x1={PAD.left} y1={H - PAD.bottom} x2={W - PAD.right} y2={H - PAD.bottom} stroke="#3b4659" />
        <line x1={PAD.left} y1={PAD.top} x2={PAD.left} y2={H - PAD.bottom} stroke="#3b4659" />
        <text x={PAD.left} y={H - 8} fill="#8592a8" fontSize="10">0</text>
        <text x={W - PAD.right} y={H - 8} fill="#8592a8" fontSize="10" textAnchor="end">
          proper time {secondsPerM ? formatDuration(xMax * secondsPerM) : `${formatNumber(xMax)} M`}
        </text>
        <text x={PAD.left - 4} y={PAD.top + 8} fill="#8592a8" fontSize="10" textAnchor="end">{formatNumber(yMax, 3)} s</text>
        <text x={PAD.left - 4} y={H - PAD.bottom} fill="#8592a8" fontSize="10" textAnchor="end">0 s</text>
        <line x1={sx(pathDuration)} x2={sx(pathDuration)} y1={PAD.top} y2={H - PAD.bottom} stroke="#5b6880" strokeDasharray="3 3" />
        <line x1={sx(tau)} x2={sx(tau)} y1={PAD.top} y2={H - PAD.bottom} stroke="#c4b5fd" strokeWidth={1.5} />
        <path d={curvePath} fill="none" stroke="#36cdb9" strokeWidth={2} />
        {points.map((p, i) => (
          <circle
            key={i}
            cx={sx(p.properTime)}
            cy={sy(p.screenTime)}
            r={selected === i ? 7 : 5.5}
            tabIndex={canEdit ? 0 : -1}
            role="slider"
            aria-label={`Pacing handle ${i + 1}`}
            aria-valuetext={`proper time ${secondsPerM ? formatDuration(p.properTime * secondsPerM) : p.properTime}, screen time ${formatNumber(p.screenTime, 3)} s`}
            data-testid={`pacing-handle-${i}`}
            className="cursor-grab fill-violet-400 stroke-ink-950 outline-none focus:fill-teal-300"
            strokeWidth={2}
            onFocus={() => setSelected(i)}
            onBlur={() => setSelected(null)}
            onPointerDown={(e) => {
              if (!canEdit) return;
              (e.target as Element).setPointerCapture(e.pointerId);
              setSelected(i);
            }}
            onPointerMove={(e) => {
              if (!canEdit || selected !== i || !(e.buttons & 1)) return;
              const q = toSvg(e.clientX, e.clientY);
              moveHandle(i, fromPx(q.x, q.y));
            }}
            onKeyDown={(e) => {
              if (!canEdit) return;
              const dt = xMax / 100;
              const ds = yMax / 100;
              const moves: Record<string, [number, number]> = { ArrowLeft: [-dt, 0], ArrowRight: [dt, 0], ArrowUp: [0, ds], ArrowDown: [0, -ds] };
              if (moves[e.key]) {
                e.preventDefault();
                moveHandle(i, { properTime: p.properTime + moves[e.key][0], screenTime: p.screenTime + moves[e.key][1] });
              } else if ((e.key === 'Delete' || e.key === 'Backspace') && points.length > 2) {
                e.preventDefault();
                write(points.filter((_, k) => k !== i));
              }
            }}
          />
        ))}
      </svg>
      <p className="text-[11px] text-slate-500">
        Steeper means slower on screen. Drag a handle, or focus it and use the arrow keys; double-click the curve area to add a handle, Delete removes one. The dashed line marks
        the end of the path.
      </p>
      {issues['pacing.points'] || Object.keys(issues).find((k) => k.startsWith('pacing')) ? (
        <p role="alert" className="text-xs text-danger-400">{issues['pacing.points'] ?? issues[Object.keys(issues).find((k) => k.startsWith('pacing'))!]}</p>
      ) : null}
    </div>
  );
}

'use client';
/**
 * The sky-view page's client part: settings form (keyboard-usable native
 * controls), the view, drag to look around, wheel or +/- to zoom.
 */
import { useMemo, useRef, useState, type KeyboardEvent, type PointerEvent, type WheelEvent } from 'react';
import { SkyView } from './sky-view';
import { DEFAULT_CONTROLS, FRAME_SIZES, requestFromControls, type ViewControls } from './view-controls';

const fieldClass = 'mt-1 w-full rounded-md border border-ink-700 bg-ink-900 px-2 py-1 text-sm text-slate-200';
const labelClass = 'block text-xs font-medium text-slate-300';

function NumberField({ id, label, value, onChange, step, min, max }: { id: string; label: string; value: number; onChange: (v: number) => void; step: number; min?: number; max?: number }) {
  return (
    <div>
      <label className={labelClass} htmlFor={id}>
        {label}
      </label>
      <input
        id={id}
        type="number"
        className={fieldClass}
        value={Number.isFinite(value) ? value : ''}
        step={step}
        min={min}
        max={max}
        onChange={(e) => onChange(e.target.valueAsNumber)}
      />
    </div>
  );
}

export function SkyViewStudio() {
  const [c, setC] = useState<ViewControls>(DEFAULT_CONTROLS);
  const set = <K extends keyof ViewControls>(key: K, value: ViewControls[K]) => setC((prev) => ({ ...prev, [key]: value }));
  // one request object per distinct setting, so the view re-renders only when something changed
  const key = JSON.stringify(c);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const result = useMemo(() => requestFromControls(c), [key]);
  const drag = useRef<{ x: number; y: number } | null>(null);

  const degPerPx = () => {
    if (!result.ok) return 0.1;
    const w = result.request.width;
    return c.projection === 'flat' ? c.fovDeg / w : c.projection === 'dome' ? c.apertureDeg / w : 360 / w;
  };
  const turn = (dYaw: number, dPitch: number) =>
    setC((prev) => ({ ...prev, yawDeg: ((prev.yawDeg + dYaw + 540) % 360) - 180, pitchDeg: Math.max(-89, Math.min(89, prev.pitchDeg + dPitch)) }));
  const zoom = (factor: number) =>
    setC((prev) =>
      prev.projection === 'flat'
        ? { ...prev, fovDeg: Math.max(5, Math.min(150, prev.fovDeg * factor)) }
        : prev.projection === 'dome'
          ? { ...prev, apertureDeg: Math.max(180, Math.min(230, prev.apertureDeg * factor)) }
          : prev,
    );

  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    drag.current = { x: e.clientX, y: e.clientY };
    e.currentTarget.setPointerCapture(e.pointerId);
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (!drag.current) return;
    const k = degPerPx();
    // dragging the sky: it follows the pointer, so the look turns the other way
    turn(-(e.clientX - drag.current.x) * k, (e.clientY - drag.current.y) * k);
    drag.current = { x: e.clientX, y: e.clientY };
  };
  const onPointerUp = () => {
    drag.current = null;
  };
  const onWheel = (e: WheelEvent<HTMLDivElement>) => zoom(Math.exp(e.deltaY * 0.001));
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const step = e.shiftKey ? 10 : 2;
    const actions: Record<string, () => void> = {
      ArrowLeft: () => turn(-step, 0),
      ArrowRight: () => turn(step, 0),
      ArrowUp: () => turn(0, step),
      ArrowDown: () => turn(0, -step),
      '+': () => zoom(1 / 1.1),
      '=': () => zoom(1 / 1.1),
      '-': () => zoom(1.1),
    };
    const act = actions[e.key];
    if (act) {
      e.preventDefault();
      act();
    }
  };

  return (
    <div className="flex flex-col gap-6 xl:flex-row">
      <form className="w-full max-w-xs space-y-4 rounded-lg border border-ink-700 bg-ink-800/80 p-4" aria-label="Sky view settings" onSubmit={(e) => e.preventDefault()}>
        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-slate-200">Camera</legend>
          <NumberField id="sv-radius" label="Radius (r_s)" value={c.radiusRs} step={0.1} min={0.01} onChange={(v) => set('radiusRs', v)} />
          <div>
            <label className={labelClass} htmlFor="sv-observer">Observer</label>
            <select id="sv-observer" className={fieldClass} value={c.observer} onChange={(e) => set('observer', e.target.value as ViewControls['observer'])}>
              <option value="hover">Hovering (thrusting to stay)</option>
              <option value="fall">Falling radially</option>
            </select>
          </div>
          {c.observer === 'fall' && <NumberField id="sv-energy" label="Fall energy (−u_t; 1 = from rest far away)" value={c.energy} step={0.01} min={0} onChange={(v) => set('energy', v)} />}
          <NumberField id="sv-yaw" label="Look: turn from the hole (°, right +)" value={c.yawDeg} step={1} min={-180} max={180} onChange={(v) => set('yawDeg', v)} />
          <NumberField id="sv-pitch" label="Look: up (°)" value={c.pitchDeg} step={1} min={-89} max={89} onChange={(v) => set('pitchDeg', v)} />
        </fieldset>
        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-slate-200">Projection</legend>
          <div>
            <label className={labelClass} htmlFor="sv-projection">Projection</label>
            <select id="sv-projection" className={fieldClass} value={c.projection} onChange={(e) => set('projection', e.target.value as ViewControls['projection'])}>
              <option value="flat">Flat</option>
              <option value="dome">Dome master (fisheye)</option>
              <option value="equirect">Equirectangular</option>
              <option value="cubeFace">Cube face</option>
            </select>
          </div>
          {c.projection === 'flat' && <NumberField id="sv-fov" label="Field of view (°)" value={c.fovDeg} step={1} min={1} max={179} onChange={(v) => set('fovDeg', v)} />}
          {c.projection === 'dome' && (
            <>
              <NumberField id="sv-aperture" label="Aperture (°)" value={c.apertureDeg} step={1} min={180} max={230} onChange={(v) => set('apertureDeg', v)} />
              <NumberField id="sv-tilt" label="Dome tilt (°)" value={c.tiltDeg} step={1} min={-90} max={90} onChange={(v) => set('tiltDeg', v)} />
            </>
          )}
          {c.projection === 'cubeFace' && (
            <div>
              <label className={labelClass} htmlFor="sv-face">Cube face</label>
            <select id="sv-face" className={fieldClass} value={c.face} onChange={(e) => set('face', e.target.value as ViewControls['face'])}>
                {(['front', 'back', 'left', 'right', 'up', 'down'] as const).map((f) => (
                  <option key={f} value={f}>
                    {f}
                  </option>
                ))}
              </select>
            </div>
          )}
          <div>
            <label className={labelClass} htmlFor="sv-size">Frame size</label>
            <select id="sv-size" className={fieldClass} value={c.size} onChange={(e) => set('size', e.target.value as ViewControls['size'])}>
              {Object.entries(FRAME_SIZES).map(([key, s]) => (
                <option key={key} value={key}>
                  {s.label}
                </option>
              ))}
            </select>
          </div>
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="text-sm font-semibold text-slate-200">Overlays</legend>
          <label className="flex items-center gap-2 text-sm text-slate-300" htmlFor="sv-sources">
            <input id="sv-sources" type="checkbox" className="accent-teal-400" checked={c.sources} onChange={(e) => set('sources', e.target.checked)} />
            Where the light comes from (celestial grid through the lensing)
          </label>
          <label className="flex items-center gap-2 text-sm text-slate-300" htmlFor="sv-grids">
            <input id="sv-grids" type="checkbox" className="accent-teal-400" checked={c.grids} onChange={(e) => set('grids', e.target.checked)} />
            Horizon and far-side grids
          </label>
        </fieldset>
      </form>
      <section className="min-w-0 flex-1 space-y-2" aria-label="Sky view">
        {result.ok ? (
          <>
            <div
              tabIndex={0}
              role="application"
              aria-label="Lensed sky: drag or use the arrow keys to look around, scroll or press + and - to zoom"
              className="inline-block cursor-grab touch-none select-none rounded-md active:cursor-grabbing"
              onPointerDown={onPointerDown}
              onPointerMove={onPointerMove}
              onPointerUp={onPointerUp}
              onPointerCancel={onPointerUp}
              onWheel={onWheel}
              onKeyDown={onKeyDown}
              data-testid="sky-view-surface"
            >
              <SkyView request={result.request} mode={c.sources ? 'sources' : 'image'} />
            </div>
            <p className="text-xs text-slate-500">
              Overlays and tone mapping (exponential, 0 EV) are non-physical choices; the accuracy report lists them.
            </p>
          </>
        ) : (
          <p role="alert" data-testid="sky-view-error" className="rounded-md border border-danger-500/40 bg-ink-800 p-3 text-sm text-danger-400">
            {result.message}
          </p>
        )}
      </section>
    </div>
  );
}

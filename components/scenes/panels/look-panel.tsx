'use client';

import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { SceneSpecInput } from '@/lib/scenes/schema';
import { lookAt, sortKeyframes } from '@/lib/scenes/look';
import { useEditor, usePlayhead } from '../editor/editor-context';
import { Group, NumberField, SelectField } from '../editor/fields';
import { FieldRow, NumberInput } from '../editor/number-input';
import { formatDuration } from '../editor/format';

const DEG = Math.PI / 180;

/**
 * Look direction as two angles a producer can picture: turn (yaw) from "at the
 * hole" towards the direction of motion, and tilt (pitch) out of the orbital
 * plane. Camera frame: e1 outward, e2 along the motion, e3 normal.
 */
export function directionToAngles(v: readonly number[]): { yawDeg: number; pitchDeg: number } {
  const n = Math.hypot(v[0], v[1], v[2]) || 1;
  const pitch = Math.asin(Math.max(-1, Math.min(1, v[2] / n)));
  const yaw = Math.atan2(v[1] / n, -v[0] / n);
  return { yawDeg: yaw / DEG, pitchDeg: pitch / DEG };
}

/** Inverse of directionToAngles: a unit vector in the camera frame. */
export function anglesToDirection(yawDeg: number, pitchDeg: number): [number, number, number] {
  const y = yawDeg * DEG;
  const p = pitchDeg * DEG;
  return [-Math.cos(p) * Math.cos(y), Math.cos(p) * Math.sin(y), Math.sin(p)];
}

const UP_PRESETS: { value: string; label: string; vector: [number, number, number] }[] = [
  { value: 'normal', label: 'orbit normal (north of the path)', vector: [0, 0, 1] },
  { value: 'outward', label: 'away from the hole', vector: [1, 0, 0] },
  { value: 'ahead', label: 'direction of motion', vector: [0, 1, 0] },
];

const PROJECTIONS = [
  { value: 'flat', label: 'Flat (rectilinear)' },
  { value: 'dome', label: 'Dome master (fisheye)' },
  { value: 'equirect', label: 'Equirectangular 360 × 180' },
];

/** Look panel: keyframes for look and up direction, field of view and roll; projection and dome tilt. */
export function LookPanel() {
  const { canEdit, secondsPerM, time } = useEditor();
  const { tau } = usePlayhead();
  const { control, setValue } = useFormContext<SceneSpecInput>();
  const keyframes = useFieldArray({ control, name: 'look.keyframes' });
  const values = useWatch({ control, name: 'look.keyframes' });
  const projection = useWatch({ control, name: 'projection' });
  const toSeconds = (m: number) => (time ? time.fromM(m) : m);
  const fromSeconds = (v: number) => (time ? time.toM(v) : v);

  const addAtScrubber = () => {
    let state;
    try {
      state = lookAt(values as never, tau);
    } catch {
      state = { look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 60, rollDeg: 0 };
    }
    keyframes.append({ tau, look: state.look as [number, number, number], up: state.up as [number, number, number], fovDeg: state.fovDeg, rollDeg: state.rollDeg });
  };

  return (
    <div className="space-y-3" data-testid="look-panel">
      <Group title="Projection">
        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField
            name="projection.kind"
            label="Frame"
            options={PROJECTIONS}
            onPicked={(kind) => {
              if (kind === 'flat') setValue('projection', { kind: 'flat', fovDeg: 60 }, { shouldDirty: true });
              if (kind === 'dome') setValue('projection', { kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, { shouldDirty: true });
              if (kind === 'equirect') setValue('projection', { kind: 'equirect' }, { shouldDirty: true });
            }}
          />
          {projection?.kind === 'dome' ? (
            <>
              <NumberField name="projection.apertureDeg" label="Aperture" unit="°" hint="180 to 230" step={5} />
              <NumberField name="projection.tiltDeg" label="Dome tilt" unit="°" hint="turns the frame centre towards the front" step={5} />
            </>
          ) : null}
        </div>
      </Group>
      <p className="text-xs text-slate-400">
        Keyframes are placed on the traveller&apos;s proper time; between them the view turns smoothly along the shortest arc. Turn 0° looks at the hole, 90° along the motion,
        180° away from the hole; tilt lifts the view out of the orbital plane.
      </p>
      <ol className="space-y-3">
        {keyframes.fields.map((field, index) => (
          <li key={field.id}>
            <Group
              title={`Keyframe ${index + 1}`}
              actions={
                canEdit && keyframes.fields.length > 1 ? (
                  <button type="button" className="text-xs text-slate-400 hover:text-danger-400" onClick={() => keyframes.remove(index)} aria-label={`Remove keyframe ${index + 1}`}>
                    Remove
                  </button>
                ) : null
              }
            >
              <div className="grid gap-3 sm:grid-cols-3">
                <NumberField name={`look.keyframes.${index}.tau`} label="At proper time" unit={time?.unit ?? 'M'} toDisplay={toSeconds} fromDisplay={fromSeconds} />
                <DirectionFields index={index} />
                <UpField index={index} />
                {projection?.kind === 'flat' ? <NumberField name={`look.keyframes.${index}.fovDeg`} label="Field of view" unit="°" step={5} /> : null}
                <NumberField name={`look.keyframes.${index}.rollDeg`} label="Roll" unit="°" step={5} />
              </div>
            </Group>
          </li>
        ))}
      </ol>
      {canEdit ? (
        <button type="button" data-testid="add-keyframe" onClick={addAtScrubber} className="rounded-md border border-slate-600 px-2 py-1 text-xs text-slate-300 hover:border-teal-400 hover:text-teal-300">
          + Keyframe at the scrubber ({secondsPerM ? formatDuration(tau * secondsPerM) : `${tau.toFixed(2)} M`} proper time)
        </button>
      ) : null}
      <KeyframeOrderNote />
    </div>
  );
}

function KeyframeOrderNote() {
  const values = useWatch({ name: 'look.keyframes' }) as { tau: number }[] | undefined;
  if (!values || values.length < 2) return null;
  const sorted = sortKeyframes(values as never[]) as { tau: number }[];
  return sorted.some((k, i) => k !== values[i]) ? <p className="text-xs text-slate-500">Keyframes apply in time order, whatever their order in this list.</p> : null;
}

function DirectionFields({ index }: { index: number }) {
  const { canEdit, issues } = useEditor();
  const { setValue } = useFormContext<SceneSpecInput>();
  const look = useWatch({ name: `look.keyframes.${index}.look` as never }) as number[] | undefined;
  const { yawDeg, pitchDeg } = directionToAngles(look ?? [-1, 0, 0]);
  const set = (yaw: number, pitch: number) => {
    if (!Number.isFinite(yaw) || !Number.isFinite(pitch)) return;
    setValue(`look.keyframes.${index}.look` as never, anglesToDirection(yaw, pitch) as never, { shouldDirty: true });
  };
  const id = `f-look-keyframes-${index}`;
  return (
    <>
      <FieldRow id={`${id}-yaw`} label="Turn from the hole" error={issues[`look.keyframes.${index}.look`]}>
        <NumberInput id={`${id}-yaw`} value={Number(yawDeg.toFixed(3))} onChange={(v) => set(v ?? Number.NaN, pitchDeg)} unit="°" disabled={!canEdit} step={5} />
      </FieldRow>
      <FieldRow id={`${id}-pitch`} label="Tilt out of the plane">
        <NumberInput id={`${id}-pitch`} value={Number(pitchDeg.toFixed(3))} onChange={(v) => set(yawDeg, Math.max(-90, Math.min(90, v ?? Number.NaN)))} unit="°" disabled={!canEdit} step={5} />
      </FieldRow>
    </>
  );
}

function UpField({ index }: { index: number }) {
  const { canEdit } = useEditor();
  const { setValue } = useFormContext<SceneSpecInput>();
  const up = useWatch({ name: `look.keyframes.${index}.up` as never }) as number[] | undefined;
  const match = UP_PRESETS.find((p) => up && p.vector.every((c, i) => Math.abs(c - up[i]) < 1e-9));
  const id = `f-look-keyframes-${index}-up`;
  return (
    <FieldRow id={id} label="Frame top towards">
      <select
        id={id}
        disabled={!canEdit}
        value={match?.value ?? 'custom'}
        onChange={(e) => {
          const preset = UP_PRESETS.find((p) => p.value === e.target.value);
          if (preset) setValue(`look.keyframes.${index}.up` as never, preset.vector as never, { shouldDirty: true });
        }}
        className="w-full rounded-md border border-slate-600 bg-ink-900 px-2 py-1.5 text-sm text-slate-200 disabled:opacity-70"
      >
        {UP_PRESETS.map((p) => <option key={p.value} value={p.value}>{p.label}</option>)}
        {!match ? <option value="custom">custom ({up?.map((c) => c.toFixed(2)).join(', ')})</option> : null}
      </select>
    </FieldRow>
  );
}

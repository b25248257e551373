'use client';

import { useState } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { SceneSpecInput, SegmentSpec } from '@/lib/scenes/schema';
import { useEditor } from '../editor/editor-context';
import { Group, NumberField, SelectField } from '../editor/fields';
import { FieldRow } from '../editor/number-input';
import { formatDuration, formatNumber } from '../editor/format';
import { FALL_KINDS, SEGMENT_HINTS, SEGMENT_LABELS, segmentOfKind, type SegmentKind } from './path-segments';

const toRs = (m: number) => m / 2;
const fromRs = (rs: number) => rs * 2;
const KIND_OPTIONS = (Object.keys(SEGMENT_LABELS) as SegmentKind[]).map((k) => ({ value: k, label: SEGMENT_LABELS[k] }));

/** Path panel: the camera path as a list of segments (product.md flow 2). */
export function PathPanel() {
  const { canEdit, live, issues } = useEditor();
  const { control } = useFormContext<SceneSpecInput>();
  const segments = useFieldArray({ control, name: 'path.segments' });
  const values = useWatch({ control, name: 'path.segments' }) as SegmentSpec[];
  const chainIssue = issues['path.segments'] ?? issues['path'];
  return (
    <div className="space-y-3" data-testid="path-panel">
      <p className="text-xs text-slate-400">Radii in Schwarzschild radii (r_s = 2GM/c², the event horizon is at 1 r_s); times are the traveller&apos;s proper time in seconds for this mass.</p>
      {chainIssue ? <p role="alert" className="text-xs text-danger-400">{chainIssue}</p> : null}
      <ol className="space-y-3">
        {segments.fields.map((field, index) => (
          <li key={field.id}>
            <SegmentCard
              index={index}
              count={segments.fields.length}
              value={values?.[index]}
              onKind={(kind) => segments.update(index, segmentOfKind(kind, values?.[index], index === 0))}
              onMove={(to) => segments.move(index, to)}
              onRemove={() => segments.remove(index)}
              built={live?.worldline.segments[index]}
            />
          </li>
        ))}
      </ol>
      {canEdit ? (
        <div className="flex flex-wrap gap-2">
          {(['hover', 'circular-orbit', 'drop', 'fall', 'free-fall', 'hold'] as SegmentKind[]).map((kind) => (
            <button
              key={kind}
              type="button"
              data-testid={`add-segment-${kind}`}
              className="rounded-md border border-slate-600 px-2 py-1 text-xs text-slate-300 hover:border-teal-400 hover:text-teal-300"
              onClick={() => segments.append(segmentOfKind(kind, undefined, segments.fields.length === 0))}
            >
              + {SEGMENT_LABELS[kind]}
            </button>
          ))}
        </div>
      ) : null}
    </div>
  );
}

type Built = NonNullable<ReturnType<typeof useEditor>['live']>['worldline']['segments'][number];

function SegmentCard({
  index,
  count,
  value,
  onKind,
  onMove,
  onRemove,
  built,
}: {
  index: number;
  count: number;
  value: SegmentSpec | undefined;
  onKind: (kind: SegmentKind) => void;
  onMove: (to: number) => void;
  onRemove: () => void;
  built: Built | undefined;
}) {
  const { canEdit, secondsPerM, live, time } = useEditor();
  const base = `path.segments.${index}`;
  const kind = value?.kind ?? 'hover';
  const toSeconds = (m: number) => (time ? time.fromM(m) : m);
  const fromSeconds = (v: number) => (time ? time.toM(v) : v);
  const timeUnit = time?.unit ?? 'M';
  const previous = index > 0 ? live?.worldline.segments[index - 1] : undefined;
  return (
    <Group
      title={`${index + 1} · ${SEGMENT_LABELS[kind]}`}
      actions={
        canEdit ? (
          <div className="flex gap-1 text-xs">
            <IconButton label={`Move segment ${index + 1} up`} disabled={index === 0} onClick={() => onMove(index - 1)}>↑</IconButton>
            <IconButton label={`Move segment ${index + 1} down`} disabled={index === count - 1} onClick={() => onMove(index + 1)}>↓</IconButton>
            <IconButton label={`Remove segment ${index + 1}`} disabled={count === 1} onClick={onRemove}>✕</IconButton>
          </div>
        ) : null
      }
    >
      <p className="text-xs text-slate-500">{SEGMENT_HINTS[kind]}</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField name={`${base}.kind`} label="Kind" options={KIND_OPTIONS} onPicked={(k) => onKind(k as SegmentKind)} />
        {index === 0 && kind !== 'hold' ? (
          <NumberField name={`${base}.r`} label="Start radius" unit="r_s" toDisplay={toRs} fromDisplay={fromRs} step={0.5} testId={`segment-${index}-r`} />
        ) : (
          <div className="text-xs text-slate-400">
            <p className="font-medium text-slate-300">Start radius</p>
            <p className="mt-2">{previous ? `where segment ${index} ends: ${formatNumber(previous.end.r / 2)} r_s` : `where segment ${index} ends`}</p>
          </div>
        )}
        {kind === 'circular-orbit' ? (
          <SelectField name={`${base}.sense`} label="Direction" options={[{ value: 1, label: 'along the motion (+)' }, { value: -1, label: 'against it (−)' }]} parse={Number} />
        ) : null}
        {kind === 'fall' ? <NumberField name={`${base}.speed`} label="Speed at the start (measured by a hovering observer)" unit="c" step={0.01} /> : null}
        {kind === 'free-fall' ? (
          <>
            <NumberField name={`${base}.energy`} label="Energy per unit mass (−u_t)" hint="1 = falling from rest far away" step={0.01} />
            <NumberField name={`${base}.angularMomentum`} label="Angular momentum per unit mass" unit="GM/c" hint="above 4 (2√3 for a bound path) a barrier can turn the fall back" step={0.1} />
            <SelectField name={`${base}.radialSense`} label="Moving" options={[{ value: 'in', label: 'inward' }, { value: 'out', label: 'outward' }]} />
          </>
        ) : null}
        {kind === 'hold' ? <NumberField name={`${base}.orbitalSpeed`} label="Circling speed (measured by a hovering observer)" unit="c" optional step={0.01} /> : null}
        <DurationControl index={index} kind={kind} toSeconds={toSeconds} fromSeconds={fromSeconds} timeUnit={timeUnit} />
      </div>
      {built ? (
        <p className="text-xs text-teal-300" data-testid={`segment-${index}-summary`}>
          Lasts {secondsPerM ? formatDuration(built.duration * secondsPerM) : `${formatNumber(built.duration)} M`} of proper time;{' '}
          {built.endsAtSingularity ? 'ends at the singularity.' : `ends at ${formatNumber(built.end.r / 2)} r_s.`}
        </p>
      ) : null}
    </Group>
  );
}

type DurationMode = 'time' | 'singularity' | 'radius';

/**
 * Length of a segment: a proper time, until the singularity (falls), or until a radius (falls). The radius is
 * stored as the segment's untilR and resolved by the engine, so it still holds after the mass or an earlier
 * segment changes.
 */
function DurationControl({ index, kind, toSeconds, fromSeconds, timeUnit }: { index: number; kind: SegmentKind; toSeconds: (m: number) => number; fromSeconds: (s: number) => number; timeUnit: string }) {
  const { canEdit } = useEditor();
  const { setValue } = useFormContext<SceneSpecInput>();
  const durationName = `path.segments.${index}.duration`;
  const untilName = `path.segments.${index}.untilR`;
  const duration = useWatch({ name: durationName as never }) as unknown as number | undefined;
  const untilR = useWatch({ name: untilName as never }) as unknown as number | undefined;
  const isFall = FALL_KINDS.includes(kind);
  const [mode, setMode] = useState<DurationMode>(isFall && untilR !== undefined ? 'radius' : isFall && duration === undefined ? 'singularity' : 'time');
  const effectiveMode: DurationMode = !isFall && mode !== 'time' ? 'time' : mode;
  const set = (name: string, value: number | undefined) => setValue(name as never, value as never, { shouldDirty: true, shouldValidate: true });
  const id = `f-path-segments-${index}-duration-mode`;
  return (
    <>
      <FieldRow id={id} label="Length">
        <select
          id={id}
          data-testid={id}
          disabled={!canEdit}
          className="w-full rounded-md border border-slate-600 bg-ink-900 px-2 py-1.5 text-sm text-slate-200 disabled:opacity-70"
          value={effectiveMode}
          onChange={(e) => {
            const next = e.target.value as DurationMode;
            setMode(next);
            if (next !== 'radius' && untilR !== undefined) set(untilName, undefined);
            if (next !== 'time' && duration !== undefined) set(durationName, undefined);
            if (next === 'time' && duration === undefined) set(durationName, 10);
          }}
        >
          <option value="time">for a proper time</option>
          {isFall ? <option value="singularity">until the singularity</option> : null}
          {isFall ? <option value="radius">until a radius is reached</option> : null}
        </select>
      </FieldRow>
      {effectiveMode === 'time' ? (
        <NumberField name={durationName} label="Proper time" unit={timeUnit} toDisplay={toSeconds} fromDisplay={fromSeconds} testId={`segment-${index}-duration`} />
      ) : null}
      {effectiveMode === 'radius' ? (
        <NumberField
          name={untilName}
          label="Until radius"
          unit="r_s"
          hint={untilR === undefined ? 'the radius where this fall ends; until then it runs to the singularity' : 'the fall ends the first time it reaches this radius'}
          toDisplay={toRs}
          fromDisplay={fromRs}
          optional
          step={0.1}
          testId={`segment-${index}-until-r`}
        />
      ) : null}
    </>
  );
}

function IconButton({ label, disabled, onClick, children }: { label: string; disabled?: boolean; onClick: () => void; children: React.ReactNode }) {
  return (
    <button type="button" aria-label={label} title={label} disabled={disabled} onClick={onClick} className="rounded px-1.5 py-0.5 text-slate-400 hover:bg-ink-700 hover:text-teal-300 disabled:opacity-30">
      {children}
    </button>
  );
}

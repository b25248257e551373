'use client';

import { useFormContext } from 'react-hook-form';
import type { SceneSpecInput } from '@/lib/scenes/schema';
import { useEditor } from '../editor/editor-context';
import { Group, NumberField } from '../editor/fields';
import { formatDuration, formatNumber } from '../editor/format';

const MASS_PRESETS = [
  { label: 'K-7 (4.1 million M☉)', value: 4.1e6 },
  { label: 'Stellar (12 M☉)', value: 12 },
  { label: 'Sagittarius A*-like (4 million M☉)', value: 4e6 },
  { label: 'Giant (6.5 billion M☉)', value: 6.5e9 },
];

/** Radii the charts and readouts mark (physics.md section 2), in M. */
const MARKED_RADII = [
  { name: 'event horizon', rM: 2 },
  { name: 'photon sphere', rM: 3 },
  { name: 'marginally bound orbit', rM: 4 },
  { name: 'ISCO', rM: 6 },
];

/** Physics panel: the hole's mass, what it means in SI, and the idealisations behind every frame. */
export function PhysicsPanel() {
  const { canEdit, secondsPerM, metresPerM } = useEditor();
  const { setValue } = useFormContext<SceneSpecInput>();
  return (
    <div className="space-y-3" data-testid="physics-panel">
      <Group title="Black hole">
        <NumberField name="massSolar" label="Mass" unit="solar masses" hint="non-spinning, uncharged (Schwarzschild)" testId="mass-input" />
        {canEdit ? (
          <div className="flex flex-wrap gap-2">
            {MASS_PRESETS.map((p) => (
              <button key={p.label} type="button" onClick={() => setValue('massSolar', p.value, { shouldDirty: true })} className="rounded-md border border-slate-600 px-2 py-1 text-xs text-slate-300 hover:border-teal-400 hover:text-teal-300">
                {p.label}
              </button>
            ))}
          </div>
        ) : null}
        {secondsPerM && metresPerM ? (
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-xs">
            <dt className="text-slate-400">GM/c³ (one unit of time)</dt>
            <dd className="tabular-nums text-slate-200">{formatDuration(secondsPerM)}</dd>
            {MARKED_RADII.map((r) => (
              <div key={r.name} className="contents">
                <dt className="text-slate-400">{r.name} ({formatNumber(r.rM / 2)} r_s)</dt>
                <dd className="tabular-nums text-slate-200">{formatNumber((r.rM * metresPerM) / 1000)} km</dd>
              </div>
            ))}
            <dt className="text-slate-400">fall from rest at the horizon</dt>
            <dd className="tabular-nums text-slate-200">{formatDuration(Math.PI * secondsPerM)}</dd>
          </dl>
        ) : null}
      </Group>
      <Group title="Idealisations (shown in the accuracy report)">
        <ul className="list-disc space-y-1 pl-5 text-xs text-slate-400">
          <li>The hole is eternal, isolated and non-spinning; nothing falls in but the camera.</li>
          <li>Light from the far side exists only for the eternal solution.</li>
          <li>Stars are at rest far away; the Milky Way glows as one 5000 K colour.</li>
          <li>Tides act across a 2 m body; the disruption line on the charts is an illustrative assumption.</li>
        </ul>
      </Group>
    </div>
  );
}

'use client';

import { useWatch } from 'react-hook-form';
import { Group, NumberField, SelectField, SwitchField } from '../editor/fields';

/** Sky panel: light sources, effect switches and exposure. Every switch turned off is listed in the accuracy report. */
export function SkyPanel() {
  const panorama = useWatch({ name: 'sky.panorama' }) as { source: string } | undefined;
  return (
    <div className="space-y-3" data-testid="sky-panel">
      <Group title="Sources">
        <SwitchField name="sky.stars.enabled" label="Stars" hint="Hipparcos-based catalogue to magnitude 8, coloured by temperature" />
        <div className="grid gap-3 pl-6 sm:grid-cols-2">
          <NumberField name="sky.stars.magnitudeLimit" label="Faintest magnitude" step={0.5} />
          <NumberField name="sky.stars.gain" label="Star brightness gain" hint="1 = physical" step={0.5} />
        </div>
        <SwitchField name="sky.milkyWay.enabled" label="Milky Way glow" />
        <div className="grid gap-3 pl-6 sm:grid-cols-2">
          <NumberField name="sky.milkyWay.gain" label="Milky Way gain" hint="1 = physical" step={0.5} />
        </div>
        <p className="text-xs text-slate-500">
          {panorama ? `Panorama: ${panorama.source} (drawn in renders; the live preview shows stars and Milky Way only).` : 'Panoramas from the Library can be added once the Library opens.'}
        </p>
      </Group>
      <Group title="Effects">
        <SwitchField name="effects.lensing" label="Gravitational lensing" hint="off: the plain, unbent sky" />
        <SwitchField name="effects.colourShift" label="Frequency-shift colours" />
        <SwitchField name="effects.beaming" label="Brightening and dimming (g⁴)" />
        <SwitchField name="effects.horizonGrid.enabled" label="Horizon grid (thin teal lines)" />
        <SwitchField name="effects.farSideGrid.enabled" label="Far-side grid (dashed violet)" hint="light from the far exterior, eternal solution only" />
      </Group>
      <Group title="Exposure">
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField name="exposure.ev" label="Exposure" unit="EV" step={0.5} />
          <SelectField
            name="exposure.toneMap"
            label="Tone mapping"
            options={[
              { value: 'exponential', label: 'Exponential' },
              { value: 'reinhard', label: 'Reinhard' },
              { value: 'none', label: 'None (clip)' },
            ]}
          />
        </div>
      </Group>
    </div>
  );
}

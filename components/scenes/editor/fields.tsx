'use client';

import type { ReactNode } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import { useEditor } from './editor-context';
import { FieldRow, NumberInput } from './number-input';

const fieldId = (name: string) => `f-${name.replace(/\./g, '-')}`;

/** A numeric field of the scene, shown in display units, with the schema's message for its path. */
export function NumberField({
  name,
  label,
  unit,
  hint,
  toDisplay,
  fromDisplay,
  optional,
  step,
  testId,
}: {
  name: string;
  label: string;
  unit?: string;
  hint?: string;
  toDisplay?: (v: number) => number;
  fromDisplay?: (v: number) => number;
  optional?: boolean;
  step?: number;
  testId?: string;
}) {
  const { canEdit, issues } = useEditor();
  const { field } = useController({ name: name as never });
  const id = fieldId(name);
  const error = issues[name];
  return (
    <FieldRow id={id} label={label} hint={hint} error={error}>
      <NumberInput
        id={id}
        testId={testId ?? id}
        value={field.value as number | undefined}
        onChange={(v) => field.onChange(v)}
        toDisplay={toDisplay}
        fromDisplay={fromDisplay}
        optional={optional}
        invalid={!!error}
        disabled={!canEdit}
        unit={unit}
        step={step}
      />
    </FieldRow>
  );
}

/** A select bound to a scene field; `parse` turns the option text back into the stored value. */
export function SelectField<T extends string | number>({
  name,
  label,
  options,
  parse,
  hint,
  onPicked,
}: {
  name: string;
  label: string;
  options: { value: T; label: string }[];
  parse?: (text: string) => T;
  hint?: string;
  onPicked?: (value: T) => void;
}) {
  const { canEdit, issues } = useEditor();
  const { field } = useController({ name: name as never });
  const id = fieldId(name);
  return (
    <FieldRow id={id} label={label} hint={hint} error={issues[name]}>
      <select
        id={id}
        data-testid={id}
        disabled={!canEdit}
        className="w-full rounded-md border border-slate-600 bg-ink-900 px-2 py-1.5 text-sm text-slate-200 focus:border-teal-400 disabled:opacity-70"
        value={String(field.value ?? '')}
        onChange={(e) => {
          const value = parse ? parse(e.target.value) : (e.target.value as T);
          field.onChange(value);
          onPicked?.(value);
        }}
      >
        {options.map((o) => <option key={String(o.value)} value={String(o.value)}>{o.label}</option>)}
      </select>
    </FieldRow>
  );
}

/** A checkbox bound to a boolean scene field. */
export function SwitchField({ name, label, hint }: { name: string; label: string; hint?: string }) {
  const { canEdit } = useEditor();
  const { register } = useFormContext();
  const id = fieldId(name);
  return (
    <div className="flex items-start gap-2">
      <input id={id} data-testid={id} type="checkbox" disabled={!canEdit} className="mt-0.5 accent-teal-400" {...register(name)} />
      <label htmlFor={id} className="text-sm text-slate-300">
        {label}
        {hint ? <span className="block text-xs text-slate-500">{hint}</span> : null}
      </label>
    </div>
  );
}

/** A small titled group inside a panel. */
export function Group({ title, children, actions }: { title: string; children: ReactNode; actions?: ReactNode }) {
  return (
    <div role="group" aria-label={title} className="space-y-3 rounded-md border border-ink-700 bg-ink-900/40 p-3">
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wider text-slate-400">{title}</h3>
        {actions}
      </div>
      {children}
    </div>
  );
}

'use client';

import { useEffect, useRef, useState } from 'react';

/** Text for an editable number: plain digits a person can keep typing into. */
function toText(value: number | undefined | null): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(8)));
}

/**
 * A number field that shows a stored value in display units (r_s, seconds...)
 * and writes back stored units. It keeps the producer's own text while they
 * type, so "1." or "-" are never rewritten under their fingers.
 */
export function NumberInput({
  id,
  value,
  onChange,
  toDisplay = (v) => v,
  fromDisplay = (v) => v,
  optional = false,
  invalid = false,
  disabled,
  unit,
  testId,
  label,
  step,
}: {
  id: string;
  value: number | undefined | null;
  onChange: (stored: number | undefined) => void;
  toDisplay?: (stored: number) => number;
  fromDisplay?: (display: number) => number;
  /** empty text means "not set" (undefined) instead of an invalid number */
  optional?: boolean;
  invalid?: boolean;
  disabled?: boolean;
  unit?: string;
  testId?: string;
  label?: string;
  step?: number;
}) {
  const focused = useRef(false);
  const display = value === undefined || value === null || !Number.isFinite(value) ? value : toDisplay(value);
  const [text, setText] = useState(() => toText(display));
  useEffect(() => {
    if (!focused.current) setText(toText(display));
  }, [display]);
  return (
    <div className="flex items-center gap-1.5">
      <input
        id={id}
        aria-label={label}
        data-testid={testId}
        inputMode="decimal"
        autoComplete="off"
        disabled={disabled}
        aria-invalid={invalid || undefined}
        aria-describedby={invalid ? `${id}-error` : undefined}
        className="w-full min-w-0 rounded-md border border-slate-600 bg-ink-900 px-2 py-1.5 text-sm tabular-nums text-slate-200 focus:border-teal-400 disabled:opacity-70 aria-[invalid=true]:border-danger-500"
        value={text}
        onFocus={() => (focused.current = true)}
        onBlur={() => {
          focused.current = false;
          setText(toText(display));
        }}
        onKeyDown={(e) => {
          if (!step || (e.key !== 'ArrowUp' && e.key !== 'ArrowDown')) return;
          e.preventDefault();
          const current = Number(text);
          if (!Number.isFinite(current)) return;
          const next = Number((current + (e.key === 'ArrowUp' ? step : -step)).toPrecision(10));
          setText(String(next));
          onChange(fromDisplay(next));
        }}
        onChange={(e) => {
          const next = e.target.value;
          setText(next);
          const trimmed = next.trim().replace(/\u2009|,/g, '');
          if (trimmed === '') return onChange(optional ? undefined : Number.NaN);
          const parsed = Number(trimmed);
          onChange(Number.isFinite(parsed) ? fromDisplay(parsed) : Number.NaN);
        }}
      />
      {unit ? <span className="shrink-0 text-xs text-slate-400">{unit}</span> : null}
    </div>
  );
}

/** A compact label + control + error row used across the editor panels. */
export function FieldRow({ id, label, hint, error, children }: { id: string; label: string; hint?: string; error?: string; children: React.ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-xs font-medium text-slate-300">{label}</label>
      {children}
      {hint && !error ? <p className="text-xs text-slate-500">{hint}</p> : null}
      {error ? <p id={`${id}-error`} role="alert" className="text-xs text-danger-400" data-testid={`${id}-error`}>{error}</p> : null}
    </div>
  );
}

import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';

const control = 'w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400 aria-[invalid=true]:border-danger-500';

/** A labelled form control with its error message announced to screen readers. */
export function Field({ id, label, error, children }: { id: string; label: string; error?: string; children: ReactNode }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium text-slate-300">{label}</label>
      {children}
      {error ? <p id={`${id}-error`} role="alert" className="text-sm text-danger-400">{error}</p> : null}
    </div>
  );
}

export function TextInput({ invalid, ...props }: InputHTMLAttributes<HTMLInputElement> & { invalid?: boolean }) {
  return <input className={control} aria-invalid={invalid || undefined} aria-describedby={invalid ? `${props.id}-error` : undefined} {...props} />;
}

export function Select({ invalid, ...props }: SelectHTMLAttributes<HTMLSelectElement> & { invalid?: boolean }) {
  return <select className={control} aria-invalid={invalid || undefined} {...props} />;
}

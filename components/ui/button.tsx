import type { ButtonHTMLAttributes } from 'react';

const variants = {
  primary: 'bg-teal-500 text-ink-950 hover:bg-teal-400 disabled:bg-slate-600 disabled:text-slate-300',
  secondary: 'border border-slate-600 text-slate-200 hover:border-teal-400 hover:text-teal-300',
  danger: 'border border-danger-500/60 text-danger-400 hover:bg-danger-500/10',
} as const;

export function Button({ variant = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: keyof typeof variants }) {
  return (
    <button
      className={`inline-flex items-center justify-center rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed ${variants[variant]} ${className}`}
      {...props}
    />
  );
}

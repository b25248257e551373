import type { ReactNode } from 'react';

const tones = {
  error: 'border-danger-500/50 bg-danger-500/10 text-danger-400',
  info: 'border-teal-500/40 bg-teal-500/10 text-teal-300',
  caution: 'border-violet-500/40 bg-violet-500/10 text-violet-300',
} as const;

export function Alert({ tone = 'info', children, testId }: { tone?: keyof typeof tones; children: ReactNode; testId?: string }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} data-testid={testId} className={`rounded-md border px-3 py-2 text-sm ${tones[tone]}`}>
      {children}
    </div>
  );
}

import type { ReactNode } from 'react';

/** A titled slate card, the basic block of every page. */
export function Panel({ title, children, actions, testId }: { title: string; children: ReactNode; actions?: ReactNode; testId?: string }) {
  return (
    <section className="rounded-lg border border-ink-700 bg-ink-800/80 p-5 shadow-lg shadow-black/30" data-testid={testId}>
      <header className="mb-4 flex items-center justify-between gap-4">
        <h2 className="text-base font-semibold tracking-wide text-slate-200">{title}</h2>
        {actions}
      </header>
      {children}
    </section>
  );
}

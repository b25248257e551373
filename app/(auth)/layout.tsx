import type { ReactNode } from 'react';

/** Pages for people who are not signed in: a centred card on the ink background. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-[radial-gradient(ellipse_at_top,_#1a2233,_#05070c_70%)] p-6">
      <div className="w-full max-w-sm space-y-6">
        <div className="text-center">
          <p className="text-2xl font-semibold tracking-wide text-slate-200">Skywell</p>
          <p className="mt-1 text-sm text-slate-400">Black-hole shots, checked and ready for the dome</p>
        </div>
        <div className="rounded-lg border border-ink-700 bg-ink-800/90 p-6 shadow-xl shadow-black/40">{children}</div>
      </div>
    </main>
  );
}

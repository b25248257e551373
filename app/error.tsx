'use client';

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <main className="mx-auto max-w-lg p-10 text-center" role="alert">
      <h1 className="text-xl font-semibold">Something went wrong</h1>
      <p className="mt-2 text-sm text-slate-400">Nothing you entered was changed. Try again; if it keeps happening, tell a studio admin.</p>
      <button type="button" onClick={reset} className="mt-4 text-sm text-teal-300 hover:underline">Try again</button>
    </main>
  );
}

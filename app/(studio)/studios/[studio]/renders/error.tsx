'use client';

import { Alert } from '@/components/ui/alert';

/** A failure on a render page keeps the studio's navigation; queued frames keep rendering regardless. */
export default function RendersError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="max-w-xl space-y-3" data-testid="renders-error">
      <Alert tone="error">This page could not be shown. Renders already queued keep running on the workers.</Alert>
      {error.digest ? <p className="text-xs text-slate-500">Reference: {error.digest}</p> : null}
      <button type="button" onClick={reset} className="text-sm text-teal-300 hover:underline">Try again</button>
    </div>
  );
}

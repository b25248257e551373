'use client';

import { Alert } from '@/components/ui/alert';

/** Shows, scenes and the editor: a failure here keeps the studio's navigation. */
export default function ShowsError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="max-w-xl space-y-3" data-testid="shows-error">
      <Alert tone="error">This page could not be shown. Nothing you saved was changed; an unsaved scene edit stays in this browser as a draft.</Alert>
      {error.digest ? <p className="text-xs text-slate-500">Reference: {error.digest}</p> : null}
      <button type="button" onClick={reset} className="text-sm text-teal-300 hover:underline">Try again</button>
    </div>
  );
}

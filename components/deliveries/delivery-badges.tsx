/** "Draft" when the revision was not approved; operators should not load drafts without asking. */
export function ApprovalBadge({ approved }: { approved: boolean }) {
  return approved ? (
    <span className="rounded-full border border-teal-400/60 px-2 py-0.5 text-xs text-teal-300" data-testid="approval">approved</span>
  ) : (
    <span className="rounded-full border border-violet-500/60 px-2 py-0.5 text-xs text-violet-300" data-testid="approval" title="The scene revision was not approved by an advisor">draft</span>
  );
}

export function LoadedBadge({ status }: { status: 'ready' | 'loaded' }) {
  return (
    <span data-testid="delivery-status" data-status={status} className={`rounded-full border px-2 py-0.5 text-xs ${status === 'loaded' ? 'border-teal-400/60 bg-teal-500/10 text-teal-300' : 'border-slate-500/60 text-slate-300'}`}>
      {status === 'loaded' ? 'loaded' : 'ready to load'}
    </span>
  );
}

/** The photosensitivity verdict in one word. */
export function VerdictBadge({ verdict }: { verdict: string }) {
  const style = verdict === 'pass' ? 'border-teal-400/60 text-teal-300' : verdict === 'fail' ? 'border-violet-400/70 bg-violet-500/15 text-violet-200' : 'border-slate-600 text-slate-400';
  return <span data-testid="verdict" className={`rounded-full border px-2 py-0.5 text-xs uppercase tracking-wider ${style}`}>{verdict}</span>;
}

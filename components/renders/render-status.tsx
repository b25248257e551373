import type { RenderStatus } from './types';

// Status colours stay in the product's teal/violet/slate family; failures use the danger tone only for text.
const STATUS_STYLE: Record<RenderStatus, string> = {
  queued: 'border-slate-500/60 text-slate-300',
  running: 'border-teal-500/60 text-teal-300',
  done: 'border-teal-400/60 bg-teal-500/10 text-teal-300',
  failed: 'border-danger-500/60 text-danger-400',
  cancelled: 'border-slate-600 text-slate-400',
};

/** A small pill with a render's status. */
export function RenderStatusBadge({ status, testId }: { status: RenderStatus; testId?: string }) {
  return (
    <span data-testid={testId} data-status={status} className={`inline-block rounded-full border px-2 py-0.5 text-xs font-medium capitalize ${STATUS_STYLE[status]}`}>
      {status}
    </span>
  );
}

/** Frames done (teal) and failed (violet) out of the total, as an accessible progress bar. */
export function RenderProgress({ done, failed, total, label, testId, size = 'sm' }: { done: number; failed: number; total: number; label: string; testId?: string; size?: 'sm' | 'lg' }) {
  const safeTotal = Math.max(total, 1);
  const donePct = (100 * done) / safeTotal;
  const failedPct = (100 * failed) / safeTotal;
  return (
    <div className="space-y-1">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${done} of ${total} frames${failed ? `, ${failed} failed` : ''}`}
        data-testid={testId}
        className={`flex w-full overflow-hidden rounded-full bg-ink-950 ring-1 ring-ink-700 ${size === 'lg' ? 'h-3' : 'h-1.5'}`}
      >
        <div className="bg-teal-400 transition-[width] duration-500" style={{ width: `${donePct}%` }} />
        <div className="bg-violet-500 transition-[width] duration-500" style={{ width: `${failedPct}%` }} />
      </div>
      <p className="text-xs tabular-nums text-slate-400">
        {done} / {total} frames{failed ? <span className="text-violet-300"> · {failed} failed</span> : null}
      </p>
    </div>
  );
}

import { VENUE_POLICY_CAUTION } from '@/lib/safety/summary';
import { Alert } from '@/components/ui/alert';
import type { FailingRange, PhotosensitivityResult } from './types';

const VERDICT_STYLE: Record<string, string> = {
  pass: 'border-teal-400/60 bg-teal-500/10 text-teal-300',
  fail: 'border-violet-400/70 bg-violet-500/15 text-violet-200',
};

function RangesTable({ title, ranges, testId }: { title: string; ranges: FailingRange[]; testId: string }) {
  if (ranges.length === 0) return null;
  return (
    <div className="space-y-1" data-testid={testId}>
      <h3 className="text-xs font-semibold uppercase tracking-wider text-slate-400">{title}</h3>
      <table className="w-full text-left text-sm tabular-nums">
        <thead className="text-xs text-slate-500"><tr><th className="py-1 pr-4 font-medium">Frames</th><th className="py-1 pr-4 font-medium">Time</th><th className="py-1 font-medium">Flashes in one second</th></tr></thead>
        <tbody>
          {ranges.map((r) => (
            <tr key={`${r.startFrame}-${r.endFrame}`} className="border-t border-ink-700/60">
              <td className="py-1 pr-4">{r.startFrame}–{r.endFrame}</td>
              <td className="py-1 pr-4">{r.startSeconds.toFixed(2)}–{r.endSeconds.toFixed(2)} s</td>
              <td className="py-1">{r.count}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * The photosensitivity check of a sequence (WCAG 2.2 SC 2.3.1, ITU-R BT.1702):
 * verdict, plain-language summary, failing time ranges, and always the
 * product's caution that venue policy and local rules decide.
 */
export function PhotosensitivityResultView({ result, pending }: { result: PhotosensitivityResult | null; pending?: boolean }) {
  const verdict = result?.verdict ?? null;
  // The stored summary ends with the venue caution; it is shown once, below, for every outcome.
  const lines = (result?.summary ?? '').split('\n').filter((line) => line.trim() !== '' && line.trim() !== VENUE_POLICY_CAUTION);
  return (
    <div className="space-y-3" data-testid="photosensitivity">
      <div className="flex items-center gap-3">
        <span className="text-sm text-slate-400">Result</span>
        <span data-testid="photosensitivity-verdict" data-verdict={verdict ?? 'pending'} className={`rounded-full border px-2.5 py-0.5 text-xs font-semibold uppercase tracking-wider ${verdict ? (VERDICT_STYLE[verdict] ?? 'border-slate-600 text-slate-300') : 'border-slate-600 text-slate-400'}`}>
          {verdict === 'not-applicable' ? 'not applicable' : verdict ?? (pending ? 'checking…' : 'not checked')}
        </span>
      </div>
      {lines.length ? <div className="space-y-1 text-sm text-slate-300" data-testid="photosensitivity-summary">{lines.map((line, i) => <p key={i}>{line}</p>)}</div> : null}
      <RangesTable title="Brightness (general) flashes" ranges={result?.generalFlashes?.failingRanges ?? []} testId="general-flash-ranges" />
      <RangesTable title="Saturated-red flashes" ranges={result?.redFlashes?.failingRanges ?? []} testId="red-flash-ranges" />
      <Alert tone="caution" testId="venue-caution">{VENUE_POLICY_CAUTION}</Alert>
    </div>
  );
}

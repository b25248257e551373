import type { ReviewDetail } from './types';

const show = (value: unknown) => (value === undefined ? '–' : JSON.stringify(value));

/** What changed since the scene's last approved revision (JSON Pointer per field). */
export function DiffList({ diff }: { diff: ReviewDetail['diffFromApproved'] }) {
  if (!diff) return <p className="text-sm text-slate-400" data-testid="diff-none">No earlier revision of this scene is approved, so there is nothing to compare with.</p>;
  if (diff.changes.length === 0) return <p className="text-sm text-slate-400" data-testid="diff-empty">Same content as approved revision {diff.from}.</p>;
  return (
    <div data-testid="diff" className="space-y-2">
      <p className="text-sm text-slate-400">{diff.changes.length} field{diff.changes.length === 1 ? '' : 's'} differ from approved revision {diff.from}.</p>
      <table className="w-full table-fixed text-left text-xs">
        <thead className="uppercase tracking-wider text-slate-500">
          <tr><th className="w-2/5 py-1 pr-2 font-medium">Field</th><th className="py-1 pr-2 font-medium">Approved</th><th className="py-1 font-medium">This revision</th></tr>
        </thead>
        <tbody>
          {diff.changes.map((c) => (
            <tr key={c.pointer} className="border-t border-ink-700 align-top" data-testid="diff-row">
              <td className="break-all py-1 pr-2 font-mono text-slate-300">{c.pointer}</td>
              <td className="break-all py-1 pr-2 font-mono text-slate-400">{show(c.before)}</td>
              <td className="break-all py-1 font-mono text-teal-300">{show(c.after)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

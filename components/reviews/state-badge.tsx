import { STATE_BADGES, STATE_LABELS, type ReviewState } from './types';

/** A review's state as a small badge. */
export function StateBadge({ state, testId }: { state: ReviewState; testId?: string }) {
  return (
    <span data-testid={testId} data-state={state} className={`inline-block rounded-full border px-2 py-0.5 text-xs font-medium ${STATE_BADGES[state]}`}>
      {STATE_LABELS[state]}
    </span>
  );
}

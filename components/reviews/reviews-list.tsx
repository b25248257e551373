'use client';

import Link from 'next/link';
import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { StateBadge } from './state-badge';
import { reviewsApi, type ReviewListItem } from './types';

/** The studio's reviews, newest first: state, scene, revision and open notes. */
export function ReviewsList({ studio }: { studio: string }) {
  const { data, error, isPending } = useQuery({ queryKey: ['reviews', studio], queryFn: () => apiFetch<{ reviews: ReviewListItem[] }>(reviewsApi(studio)) });
  if (isPending) return <p className="text-sm text-slate-400">Loading reviews…</p>;
  if (error) return <Alert tone="error">{error.message}</Alert>;
  if (data.reviews.length === 0) return <p className="text-sm text-slate-400" data-testid="no-reviews">No revision has been submitted for review yet.</p>;
  return (
    <table className="w-full text-left text-sm" data-testid="reviews-table">
      <thead className="text-xs uppercase tracking-wider text-slate-500">
        <tr>
          <th className="py-2 pr-4 font-medium">Scene</th>
          <th className="py-2 pr-4 font-medium">Revision</th>
          <th className="py-2 pr-4 font-medium">State</th>
          <th className="py-2 pr-4 font-medium">Open notes</th>
          <th className="py-2 font-medium">Submitted</th>
        </tr>
      </thead>
      <tbody>
        {data.reviews.map((r) => (
          <tr key={r.id} className="border-t border-ink-700" data-testid="review-row" data-review-id={r.id}>
            <td className="py-2 pr-4">
              <Link href={`/studios/${studio}/reviews/${r.id}`} className="text-teal-300 hover:underline">{r.sceneName}</Link>
            </td>
            <td className="py-2 pr-4 tabular-nums">{r.revision}</td>
            <td className="py-2 pr-4"><StateBadge state={r.state} /></td>
            <td className="py-2 pr-4 tabular-nums">{r.openNotes}</td>
            <td className="py-2 text-slate-400">{new Date(r.createdAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

'use client';

import { useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch, ApiError } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Select } from '@/components/ui/field';
import { reviewsApi } from './types';

type Show = { id: string; name: string };
type Scene = { id: string; name: string; latestRevision: number };
type Revision = { number: number; message: string | null; createdAt: string };
type Member = { userId: string; name: string; email: string; role: string };

/**
 * "Submit for review": pick a scene and one of its revisions, optionally name
 * advisors (admins see the member list; others notify all advisors) and add a
 * message. Advisors are e-mailed a link to the review.
 */
export function SubmitReviewForm({ studio, canListMembers }: { studio: string; canListMembers: boolean }) {
  const base = `/api/v1/studios/${studio}`;
  const router = useRouter();
  const queryClient = useQueryClient();
  const [showId, setShowId] = useState('');
  const [sceneId, setSceneId] = useState('');
  const [revision, setRevision] = useState('');
  const [advisorIds, setAdvisorIds] = useState<string[]>([]);
  const [message, setMessage] = useState('');

  const shows = useQuery({ queryKey: ['shows', studio], queryFn: () => apiFetch<{ shows: Show[] }>(`${base}/shows`) });
  const scenes = useQuery({ queryKey: ['scenes', studio, showId], enabled: Boolean(showId), queryFn: () => apiFetch<{ scenes: Scene[] }>(`${base}/shows/${showId}/scenes`) });
  const revisions = useQuery({ queryKey: ['revisions', studio, sceneId], enabled: Boolean(sceneId), queryFn: () => apiFetch<{ revisions: Revision[] }>(`${base}/scenes/${sceneId}/revisions`) });
  const members = useQuery({ queryKey: ['members', studio], enabled: canListMembers, queryFn: () => apiFetch<{ members: Member[] }>(`${base}/members`) });
  const advisors = (members.data?.members ?? []).filter((m) => m.role === 'advisor');

  const submit = useMutation({
    mutationFn: () =>
      apiFetch<{ review: { id: string } }>(reviewsApi(studio), {
        method: 'POST',
        body: { sceneId, revision: Number(revision), ...(advisorIds.length ? { advisorIds } : {}), ...(message.trim() ? { message: message.trim() } : {}) },
      }),
    onSuccess: ({ review }) => {
      void queryClient.invalidateQueries({ queryKey: ['reviews', studio] });
      router.push(`/studios/${studio}/reviews/${review.id}`);
    },
  });

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (sceneId && revision) submit.mutate();
  };
  const fieldError = (field: string) => (submit.error instanceof ApiError ? submit.error.fieldErrors.find((e) => e.field === field)?.message : undefined);

  return (
    <form onSubmit={onSubmit} className="grid gap-4 md:grid-cols-2" data-testid="submit-review-form">
      <Field id="submit-show" label="Show">
        <Select id="submit-show" data-testid="submit-show" value={showId} onChange={(e) => { setShowId(e.target.value); setSceneId(''); setRevision(''); }}>
          <option value="">Choose a show…</option>
          {shows.data?.shows.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </Select>
      </Field>
      <Field id="submit-scene" label="Scene" error={fieldError('sceneId')}>
        <Select id="submit-scene" data-testid="submit-scene" value={sceneId} disabled={!showId} onChange={(e) => {
          setSceneId(e.target.value);
          const latest = scenes.data?.scenes.find((s) => s.id === e.target.value)?.latestRevision;
          setRevision(latest ? String(latest) : '');
        }}>
          <option value="">{showId ? 'Choose a scene…' : 'Choose a show first'}</option>
          {scenes.data?.scenes.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </Select>
      </Field>
      <Field id="submit-revision" label="Revision" error={fieldError('revision')}>
        <Select id="submit-revision" data-testid="submit-revision" value={revision} disabled={!sceneId} onChange={(e) => setRevision(e.target.value)}>
          <option value="">{sceneId ? 'Choose a revision…' : 'Choose a scene first'}</option>
          {revisions.data?.revisions.map((r) => (
            <option key={r.number} value={r.number}>Revision {r.number}{r.message ? ` — ${r.message}` : ''}</option>
          ))}
        </Select>
      </Field>
      <fieldset className="space-y-1.5" data-testid="submit-advisors">
        <legend className="text-sm font-medium text-slate-300">Advisors to notify</legend>
        {canListMembers ? (
          advisors.length ? (
            <div className="space-y-1">
              {advisors.map((a) => (
                <label key={a.userId} className="flex items-center gap-2 text-sm text-slate-200">
                  <input type="checkbox" className="accent-teal-400" checked={advisorIds.includes(a.userId)} onChange={(e) => setAdvisorIds((ids) => (e.target.checked ? [...ids, a.userId] : ids.filter((id) => id !== a.userId)))} />
                  {a.name} <span className="text-slate-500">{a.email}</span>
                </label>
              ))}
              <p className="text-xs text-slate-500">Leave all unticked to notify every advisor.</p>
            </div>
          ) : (
            <p className="text-sm text-slate-400">{members.isPending ? 'Loading members…' : 'This studio has no advisor yet.'}</p>
          )
        ) : (
          <p className="text-sm text-slate-400">All advisors of the studio are e-mailed.</p>
        )}
      </fieldset>
      <div className="md:col-span-2">
        <Field id="submit-message" label="Message to the advisors (optional)">
          <textarea id="submit-message" data-testid="submit-message" rows={2} maxLength={2000} value={message} onChange={(e) => setMessage(e.target.value)} className="w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400" placeholder="What should the advisor look at first?" />
        </Field>
      </div>
      <div className="flex items-center gap-3 md:col-span-2">
        <Button type="submit" data-testid="submit-review" disabled={!sceneId || !revision || submit.isPending}>{submit.isPending ? 'Submitting…' : 'Submit for review'}</Button>
        {submit.error ? <Alert tone="error" testId="submit-error">{submit.error.message}</Alert> : null}
      </div>
    </form>
  );
}

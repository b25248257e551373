'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { reviewsApi, type NoteStatus, type ReviewDetail } from './types';

/** The review's detail (kept fresh) and the actions on it; every action refreshes the detail. */
export function useReview(studio: string, reviewId: string, initial: ReviewDetail) {
  const queryClient = useQueryClient();
  const key = ['review', studio, reviewId];
  const base = `${reviewsApi(studio)}/${reviewId}`;
  const detail = useQuery({ queryKey: key, queryFn: () => apiFetch<ReviewDetail>(base), initialData: initial });
  const refresh = () => {
    void queryClient.invalidateQueries({ queryKey: key });
    void queryClient.invalidateQueries({ queryKey: ['reviews', studio] });
  };
  const addNote = useMutation({
    mutationFn: (input: { body: string; tau?: number; point?: { x: number; y: number }; parentId?: string }) => apiFetch(`${base}/notes`, { method: 'POST', body: input }),
    onSuccess: refresh,
  });
  const setStatus = useMutation({
    mutationFn: ({ noteId, status }: { noteId: string; status: NoteStatus }) => apiFetch(`${base}/notes/${noteId}`, { method: 'PATCH', body: { status } }),
    onSuccess: refresh,
  });
  const approve = useMutation({ mutationFn: () => apiFetch(`${base}/approve`, { method: 'POST' }), onSuccess: refresh });
  const requestChanges = useMutation({ mutationFn: (message: string) => apiFetch(`${base}/request-changes`, { method: 'POST', body: { message } }), onSuccess: refresh });
  return { detail: detail.data, addNote, setStatus, approve, requestChanges };
}

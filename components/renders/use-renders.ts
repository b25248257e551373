'use client';

import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { isActive, type RenderDetail, type RenderSummary } from './types';

/** How often a page asks for progress while workers are busy (brief: every 1-2 s). */
export const PROGRESS_POLL_MS = 1500;

/** How long after "done" a page waits for the photosensitivity check and delivery before it stops asking. */
const FINALIZE_WAIT_MS = 5 * 60_000;

export const rendersKey = (studio: string) => ['studio', studio, 'renders'] as const;
export const renderKey = (studio: string, renderId: string) => ['studio', studio, 'renders', renderId] as const;

/** The studio's renders; polls while any of them is queued or running. */
export function useRenders(studio: string) {
  return useQuery({
    queryKey: rendersKey(studio),
    queryFn: () => apiFetch<{ renders: RenderSummary[] }>(`/api/v1/studios/${studio}/renders`),
    refetchInterval: (query) => (query.state.data?.renders.some((r) => isActive(r.status)) ? PROGRESS_POLL_MS : false),
  });
}

/** One render with its frames; polls until it is done, failed or cancelled. */
export function useRenderDetail(studio: string, renderId: string) {
  return useQuery({
    queryKey: renderKey(studio, renderId),
    queryFn: () => apiFetch<RenderDetail>(`/api/v1/studios/${studio}/renders/${renderId}`),
    refetchInterval: (query) => {
      const status = query.state.data?.render.status;
      // Also keep polling briefly after "done" until the photosensitivity check has been stored.
      if (!status) return false;
      if (isActive(status)) return PROGRESS_POLL_MS;
      const render = query.state.data!.render;
      const finishedMs = render.finishedAt ? Date.parse(render.finishedAt) : 0;
      const awaitingCheck = status === 'done' && render.photosensitivity === null && Date.now() - finishedMs < FINALIZE_WAIT_MS;
      return awaitingCheck ? PROGRESS_POLL_MS : false;
    },
    staleTime: 0,
  });
}

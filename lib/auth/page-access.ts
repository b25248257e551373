import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { ProblemError } from '@/lib/errors';
import { actorFromSession, authorize, type Actor, type StudioAccess } from './actor';
import type { Action } from './policy';

/**
 * The page-side twin of the API wrapper: redirects visitors to sign-in, answers
 * 404 outside the studio, and returns `forbidden: true` for a role too low so
 * the page can say so. Cached per request so layout and page share one lookup.
 */
export const pageAccess = cache(async (studioSlug: string, action: Action): Promise<{ actor: Actor; access: StudioAccess | null; forbidden: boolean }> => {
  const actor = await actorFromSession();
  if (!actor) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/studios/${studioSlug}`)}`);
  try {
    return { actor, access: await authorize(actor, studioSlug, action), forbidden: false };
  } catch (error) {
    if (error instanceof ProblemError && error.status === 403) return { actor, access: null, forbidden: true };
    if (error instanceof ProblemError && error.status === 404) notFound();
    throw error;
  }
});

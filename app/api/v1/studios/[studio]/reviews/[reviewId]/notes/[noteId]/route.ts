import { apiRoute, json } from '@/lib/api/handler';
import { noteParams, noteStatusBody } from '@/lib/api/review-schemas';
import { setNoteStatus } from '@/lib/reviews/service';

/** Advisors resolve, accept or reopen a note. */
export const PATCH = apiRoute({
  params: noteParams,
  body: noteStatusBody,
  access: { studioAction: 'reviews.comment' },
  handler: async ({ access, actor, params, body }) => {
    const note = await setNoteStatus(access!, actor!.userId, params.reviewId, params.noteId, body.status);
    return json({ note: { id: note.id, status: note.status } });
  },
});

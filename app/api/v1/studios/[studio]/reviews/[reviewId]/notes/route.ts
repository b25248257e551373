import { apiRoute, json } from '@/lib/api/handler';
import { noteBody, reviewParams } from '@/lib/api/review-schemas';
import { addNote } from '@/lib/reviews/service';

/** A new note pinned to a proper time (advisors) or a reply in a thread (parentId). */
export const POST = apiRoute({
  params: reviewParams,
  body: noteBody,
  access: { studioAction: 'reviews.comment' },
  handler: async ({ access, actor, params, body }) => {
    const note = await addNote(access!, actor!.userId, params.reviewId, body);
    return json({ note: { id: note.id, status: note.status } }, 201);
  },
});

import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { submitReviewBody } from '@/lib/api/review-schemas';
import { listReviews, submitForReview } from '@/lib/reviews/service';

export const GET = apiRoute({
  params: studioParams,
  access: { studioAction: 'reviews.read' },
  handler: async ({ access }) => json({ reviews: await listReviews(access!.studio.id) }),
});

/** Submits a scene revision for review; advisors are e-mailed a link. */
export const POST = apiRoute({
  params: studioParams,
  body: submitReviewBody,
  access: { studioAction: 'reviews.submit' },
  handler: async ({ access, actor, body }) => {
    const review = await submitForReview(access!, actor!, body);
    return json({ review: { id: review.id, state: review.state } }, 201);
  },
});

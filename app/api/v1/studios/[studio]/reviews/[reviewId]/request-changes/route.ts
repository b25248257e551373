import { apiRoute, json } from '@/lib/api/handler';
import { changesBody, reviewParams } from '@/lib/api/review-schemas';
import { requestChanges } from '@/lib/reviews/service';

export const POST = apiRoute({
  params: reviewParams,
  body: changesBody,
  access: { studioAction: 'reviews.decide' },
  handler: async ({ access, actor, params, body }) => {
    const review = await requestChanges(access!, actor!, params.reviewId, body.message);
    return json({ review: { id: review.id, state: review.state } });
  },
});

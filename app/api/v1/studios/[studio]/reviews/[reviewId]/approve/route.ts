import { apiRoute, json } from '@/lib/api/handler';
import { reviewParams } from '@/lib/api/review-schemas';
import { approve } from '@/lib/reviews/service';

/** An advisor approves the exact revision under review (every note resolved or accepted). */
export const POST = apiRoute({
  params: reviewParams,
  access: { studioAction: 'reviews.decide' },
  handler: async ({ access, actor, params }) => {
    const approval = await approve(access!, actor!, params.reviewId);
    return json({ approval: { id: approval.id, contentHash: approval.contentHash, at: approval.createdAt.toISOString() } }, 201);
  },
});

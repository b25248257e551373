import { apiRoute, json } from '@/lib/api/handler';
import { reviewParams } from '@/lib/api/review-schemas';
import { reviewDetail } from '@/lib/reviews/service';

export const GET = apiRoute({
  params: reviewParams,
  access: { studioAction: 'reviews.read' },
  handler: async ({ access, params }) => json(await reviewDetail(access!.studio.id, params.reviewId)),
});

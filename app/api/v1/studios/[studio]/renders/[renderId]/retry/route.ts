import { apiRoute, json } from '@/lib/api/handler';
import { renderParams } from '@/lib/api/render-schemas';
import { retryRender } from '@/lib/renders/service';

/** Queues again the frames of a failed or cancelled render that were never stored. */
export const POST = apiRoute({
  params: renderParams,
  access: { studioAction: 'renders.create' },
  handler: async ({ access, actor, params }) => json({ requeued: await retryRender(access!.studio.id, actor!.userId, params.renderId) }),
});

import { apiRoute, json } from '@/lib/api/handler';
import { renderParams } from '@/lib/api/render-schemas';
import { cancelRender } from '@/lib/renders/service';

export const POST = apiRoute({
  params: renderParams,
  access: { studioAction: 'renders.create' },
  handler: async ({ access, actor, params }) => {
    await cancelRender(access!.studio.id, actor!.userId, params.renderId);
    return json({ status: 'cancelled' });
  },
});

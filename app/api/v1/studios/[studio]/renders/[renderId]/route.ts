import { apiRoute, json } from '@/lib/api/handler';
import { renderParams } from '@/lib/api/render-schemas';
import { renderDetail } from '@/lib/renders/views';

/** A render with its progress, frame rate, time left and stored frames (for polling). */
export const GET = apiRoute({
  params: renderParams,
  access: { studioAction: 'renders.read' },
  handler: async ({ access, params }) => json(await renderDetail(access!.studio.id, params.renderId)),
});

import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { renderRequestSchema, requestRender } from '@/lib/renders/service';
import { listRenders } from '@/lib/renders/views';

export const GET = apiRoute({
  params: studioParams,
  access: { studioAction: 'renders.read' },
  handler: async ({ access }) => json({ renders: await listRenders(access!.studio.id) }),
});

/** Requests a still or a frame sequence of a scene revision; one queued job per frame. */
export const POST = apiRoute({
  params: studioParams,
  body: renderRequestSchema,
  access: { studioAction: 'renders.create' },
  handler: async ({ access, actor, body }) => json({ render: await requestRender(access!.studio.id, actor!.userId, body) }, 201),
});

import { apiRoute, json } from '@/lib/api/handler';
import { renameOrArchiveBody, showParams } from '@/lib/api/scene-schemas';
import { findShow, updateShow } from '@/lib/scenes/service';

export const GET = apiRoute({
  params: showParams,
  access: { studioAction: 'shows.read' },
  handler: async ({ access, params }) => {
    const show = await findShow(access!.studio.id, params.showId);
    return json({ show: { id: show.id, name: show.name, archived: show.archivedAt !== null, createdAt: show.createdAt.toISOString() } });
  },
});

/** Rename and/or archive (archived: true) or restore (archived: false). Nothing is deleted. */
export const PATCH = apiRoute({
  params: showParams,
  body: renameOrArchiveBody,
  access: { studioAction: 'shows.write' },
  handler: async ({ access, actor, params, body }) => {
    return json({ show: await updateShow(access!.studio.id, actor!.userId, params.showId, body) });
  },
});

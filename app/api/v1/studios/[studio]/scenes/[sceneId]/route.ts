import { apiRoute, json } from '@/lib/api/handler';
import { renameOrArchiveBody, sceneParams } from '@/lib/api/scene-schemas';
import { findScene, updateScene } from '@/lib/scenes/service';

export const GET = apiRoute({
  params: sceneParams,
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params }) => {
    const s = await findScene(access!.studio.id, params.sceneId);
    return json({ scene: { id: s.id, showId: s.showId, name: s.name, slug: s.slug, archived: s.archivedAt !== null, latestRevision: s.latestRevisionNumber, updatedAt: s.updatedAt.toISOString() } });
  },
});

export const PATCH = apiRoute({
  params: sceneParams,
  body: renameOrArchiveBody,
  access: { studioAction: 'scenes.write' },
  handler: async ({ access, actor, params, body }) => json({ scene: await updateScene(access!.studio.id, actor!.userId, params.sceneId, body) }),
});

import { apiRoute, json } from '@/lib/api/handler';
import { revisionParams } from '@/lib/api/scene-schemas';
import { getRevision } from '@/lib/scenes/service';

export const GET = apiRoute({
  params: revisionParams,
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params }) => json({ revision: await getRevision(access!.studio.id, params.sceneId, params.number) }),
});

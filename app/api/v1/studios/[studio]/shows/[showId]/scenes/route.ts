import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { archivedQuery, nameSchema, showParams } from '@/lib/api/scene-schemas';
import { createScene, listScenes } from '@/lib/scenes/service';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { defaultSceneSpec } from '@/lib/scenes/defaults';

export const GET = apiRoute({
  params: showParams,
  query: archivedQuery,
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params, query }) => json({ scenes: await listScenes(access!.studio.id, params.showId, query.archived === 'include') }),
});

/** Creates a scene; without a spec it starts from the default shot (a hover at 40 r_s). */
export const POST = apiRoute({
  params: showParams,
  body: z.strictObject({ name: nameSchema, spec: sceneSpecSchema.optional() }),
  maxBodyBytes: 256 * 1024,
  access: { studioAction: 'scenes.write' },
  handler: async ({ access, actor, params, body }) => json(await createScene(access!.studio.id, actor!.userId, params.showId, body.name, body.spec ?? defaultSceneSpec()), 201),
});

import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { revisionNumber, sceneParams } from '@/lib/api/scene-schemas';
import { listRevisions, saveRevision } from '@/lib/scenes/service';
import { sceneSpecSchema } from '@/lib/scenes/schema';

export const GET = apiRoute({
  params: sceneParams,
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params }) => json({ revisions: await listRevisions(access!.studio.id, params.sceneId) }),
});

/**
 * Saves an edit as a new revision. `basedOn` is the revision the editor
 * loaded; if someone saved meanwhile, both revisions are kept and the answer
 * says `superseded: true`.
 */
export const POST = apiRoute({
  params: sceneParams,
  body: z.strictObject({ basedOn: revisionNumber, spec: sceneSpecSchema, message: z.string().trim().max(500, 'message must be at most 500 characters').optional() }),
  maxBodyBytes: 256 * 1024,
  access: { studioAction: 'scenes.write' },
  handler: async ({ access, actor, params, body }) => json(await saveRevision(access!.studio.id, actor!.userId, params.sceneId, body), 201),
});

import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { revisionNumber, sceneParams } from '@/lib/api/scene-schemas';
import { diffRevisions } from '@/lib/scenes/service';

/** Which fields changed between two revisions: ?from=1&to=2 */
export const GET = apiRoute({
  params: sceneParams,
  query: z.strictObject({ from: revisionNumber, to: revisionNumber }),
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params, query }) => json(await diffRevisions(access!.studio.id, params.sceneId, query.from, query.to)),
});

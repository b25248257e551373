import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { revisionParams } from '@/lib/api/scene-schemas';
import { badRequest } from '@/lib/errors';
import { findRevision } from '@/lib/scenes/service';
import { readoutAt, sceneWorldline } from '@/lib/scenes/readout';

/**
 * Camera state and physics readouts at proper time `tau` (units of M) on a
 * revision's path: the same numbers the editor and reports show.
 */
export const GET = apiRoute({
  params: revisionParams,
  query: z.strictObject({
    tau: z.coerce.number({ error: 'tau must be a proper time in units of M' }).finite().min(0, 'tau must be zero or more'),
    bodyLength: z.coerce.number().finite().min(0).max(1000, 'bodyLength must be 0 to 1000 m').default(2),
  }),
  access: { studioAction: 'scenes.read' },
  handler: async ({ access, params, query }) => {
    const revision = await findRevision(access!.studio.id, params.sceneId, params.number);
    const worldline = sceneWorldline(revision.spec);
    if (query.tau > worldline.duration) throw badRequest(`tau must be at most the path's length, ${worldline.duration.toPrecision(6)} M.`);
    return json({ revision: revision.number, readout: readoutAt(revision.spec, worldline, query.tau, query.bodyLength) });
  },
});

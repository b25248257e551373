import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { archivedQuery, nameSchema } from '@/lib/api/scene-schemas';
import { createShow, listShows } from '@/lib/scenes/service';

/** The studio's shows (archived ones with ?archived=include). */
export const GET = apiRoute({
  params: studioParams,
  query: archivedQuery,
  access: { studioAction: 'shows.read' },
  handler: async ({ access, query }) => json({ shows: await listShows(access!.studio.id, query.archived === 'include') }),
});

export const POST = apiRoute({
  params: studioParams,
  body: z.strictObject({ name: nameSchema }),
  access: { studioAction: 'shows.write' },
  handler: async ({ access, actor, body }) => json({ show: await createShow(access!.studio.id, actor!.userId, body.name) }, 201),
});

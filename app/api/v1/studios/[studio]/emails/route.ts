import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { EmailMessage } from '@/models';

const query = z.strictObject({ limit: z.coerce.number().int().min(1, 'limit must be 1 to 200').max(200, 'limit must be 1 to 200').default(50) });

/** What Skywell sent (or failed to send) for this studio, newest first. */
export const GET = apiRoute({
  params: studioParams,
  query,
  access: { studioAction: 'emails.read' },
  handler: async ({ access, query: { limit } }) => {
    const rows = await EmailMessage.findAll({ where: { studioId: access!.studio.id }, order: [['createdAt', 'DESC']], limit });
    return json({
      emails: rows.map((e) => ({ id: e.id, kind: e.kind, to: e.toAddress, subject: e.subject, status: e.status, error: e.error, sentAt: e.createdAt.toISOString() })),
    });
  },
});

import { z } from 'zod';
import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { AuditEvent, User } from '@/models';

const query = z.strictObject({ limit: z.coerce.number().int().min(1, 'limit must be 1 to 500').max(500, 'limit must be 1 to 500').default(100) });

/** The studio's audit log, newest first. */
export const GET = apiRoute({
  params: studioParams,
  query,
  access: { studioAction: 'audit.read' },
  handler: async ({ access, query: { limit } }) => {
    const rows = await AuditEvent.findAll({
      where: { studioId: access!.studio.id },
      include: [{ model: User, as: 'actor', required: false, attributes: ['name', 'email'] }],
      order: [['createdAt', 'DESC']],
      limit,
    });
    return json({
      events: rows.map((e) => {
        const actor = (e as unknown as { actor?: User }).actor;
        return { id: e.id, action: e.action, targetType: e.targetType, targetId: e.targetId, data: e.data, actor: actor ? { name: actor.name, email: actor.email } : null, at: e.createdAt.toISOString() };
      }),
    });
  },
});

import { apiRoute, json } from '@/lib/api/handler';
import { noParams } from '@/lib/api/schemas';
import { membershipsOf } from '@/lib/auth/memberships';

/** The signed-in person and their studios with roles. */
export const GET = apiRoute({
  params: noParams,
  access: 'signed-in',
  handler: async ({ actor }) => json({ person: { id: actor!.userId, email: actor!.email, name: actor!.name }, studios: await membershipsOf(actor!.userId) }),
});

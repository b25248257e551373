import { apiRoute, json } from '@/lib/api/handler';
import { noParams } from '@/lib/api/schemas';
import { acceptInvitation } from '@/lib/studio/invitations';
import { acceptBody } from './schema';

/** Accepts an invitation with the token from its e-mail (no session needed: the token is the proof). */
export const POST = apiRoute({
  params: noParams,
  body: acceptBody,
  access: 'public',
  handler: async ({ body }) => json(await acceptInvitation(body), 200),
});

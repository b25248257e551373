import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { invite, listPendingInvitations } from '@/lib/studio/invitations';
import { inviteBody } from './schema';

/** Open invitations of the studio. */
export const GET = apiRoute({
  params: studioParams,
  access: { studioAction: 'members.invite' },
  handler: async ({ access }) => json({ invitations: await listPendingInvitations(access!.studio.id) }),
});

/** Invites a person by e-mail with a role; the e-mail holds a one-time, expiring link. */
export const POST = apiRoute({
  params: studioParams,
  body: inviteBody,
  access: { studioAction: 'members.invite' },
  handler: async ({ access, actor, body }) => json(await invite(access!, actor!, body.email, body.role), 201),
});

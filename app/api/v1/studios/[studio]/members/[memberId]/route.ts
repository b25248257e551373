import { apiRoute, json } from '@/lib/api/handler';
import { changeRole, removeMember } from '@/lib/studio/members';
import { changeRoleBody, memberParams } from './schema';

/** Changes a member's role (admins; never leaves the studio without an admin). */
export const PATCH = apiRoute({
  params: memberParams,
  body: changeRoleBody,
  access: { studioAction: 'members.update' },
  handler: async ({ access, actor, params, body }) => json({ member: await changeRole(access!, actor!.userId, params.memberId, body.role) }),
});

/** Removes a member (admins; never the last admin). */
export const DELETE = apiRoute({
  params: memberParams,
  access: { studioAction: 'members.remove' },
  handler: async ({ access, actor, params }) => {
    await removeMember(access!, actor!.userId, params.memberId);
    return new Response(null, { status: 204 });
  },
});

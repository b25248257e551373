import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { listMembers } from '@/lib/studio/members';

export const GET = apiRoute({
  params: studioParams,
  access: { studioAction: 'members.read' },
  handler: async ({ access }) => json({ members: await listMembers(access!.studio.id) }),
});

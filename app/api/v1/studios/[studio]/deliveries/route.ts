import { apiRoute, json } from '@/lib/api/handler';
import { studioParams } from '@/lib/api/schemas';
import { listDeliveries } from '@/lib/renders/deliveries';

export const GET = apiRoute({
  params: studioParams,
  access: { studioAction: 'deliveries.read' },
  handler: async ({ access }) => json({ deliveries: await listDeliveries(access!.studio.id, access!.role) }),
});

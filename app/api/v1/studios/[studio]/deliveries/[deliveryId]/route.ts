import { apiRoute, json } from '@/lib/api/handler';
import { deliveryParams } from '@/lib/api/render-schemas';
import { deliveryDetail } from '@/lib/renders/deliveries';

export const GET = apiRoute({
  params: deliveryParams,
  access: { studioAction: 'deliveries.read' },
  handler: async ({ access, params }) => json(await deliveryDetail(access!.studio.id, params.deliveryId, access!.role)),
});

import { apiRoute, json } from '@/lib/api/handler';
import { deliveryParams } from '@/lib/api/render-schemas';
import { markLoaded } from '@/lib/renders/deliveries';

/** An operator confirms the package is loaded into the venue's playback system. */
export const POST = apiRoute({
  params: deliveryParams,
  access: { studioAction: 'deliveries.mark-loaded' },
  handler: async ({ access, actor, params }) => json({ delivery: await markLoaded(access!.studio.id, actor!.userId, params.deliveryId, access!.role) }),
});

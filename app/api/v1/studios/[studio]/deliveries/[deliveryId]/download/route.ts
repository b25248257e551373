import { apiRoute } from '@/lib/api/handler';
import { deliveryParams } from '@/lib/api/render-schemas';
import { deliveryObjectKeys, findDelivery } from '@/lib/renders/deliveries';
import { deliveryZipStream } from '@/lib/renders/zip';

/** The whole package as one zip, streamed from the object store after the role check. */
export const GET = apiRoute({
  params: deliveryParams,
  access: { studioAction: 'deliveries.read' },
  handler: async ({ access, params }) => {
    const delivery = await findDelivery(access!.studio.id, params.deliveryId, access!.role);
    const name = `${delivery.manifest.scene.slug}_rev${delivery.manifest.revision.number}.zip`;
    return new Response(deliveryZipStream(delivery.manifest, await deliveryObjectKeys(delivery)), {
      headers: { 'content-type': 'application/zip', 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'no-store' },
    });
  },
});

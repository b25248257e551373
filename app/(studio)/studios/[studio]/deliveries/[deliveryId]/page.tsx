import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { Alert } from '@/components/ui/alert';
import { DeliveryDetailView } from '@/components/deliveries/delivery-detail';

export const metadata: Metadata = { title: 'Delivery' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** One frame package: manifest, checksums, photosensitivity report, download and "Mark as loaded". */
export default async function DeliveryPage({ params }: { params: Promise<{ studio: string; deliveryId: string }> }) {
  const { studio, deliveryId } = await params;
  if (!UUID.test(deliveryId)) notFound();
  const { access, forbidden } = await pageAccess(studio, 'deliveries.read');
  if (forbidden) return <Alert tone="error" testId="forbidden">You cannot see this studio&apos;s deliveries.</Alert>;
  return <DeliveryDetailView studio={studio} deliveryId={deliveryId} canMarkLoaded={roleMay(access!.role, 'deliveries.mark-loaded')} />;
}

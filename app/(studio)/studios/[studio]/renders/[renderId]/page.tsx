import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { Alert } from '@/components/ui/alert';
import { RenderDetailView } from '@/components/renders/render-detail';

export const metadata: Metadata = { title: 'Render' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** One render: live progress, frames, readout chart and photosensitivity result. */
export default async function RenderPage({ params }: { params: Promise<{ studio: string; renderId: string }> }) {
  const { studio, renderId } = await params;
  if (!UUID.test(renderId)) notFound();
  const { access, forbidden } = await pageAccess(studio, 'renders.read');
  if (forbidden) return <Alert tone="error" testId="forbidden">Renders are for producers, advisors and admins.</Alert>;
  return <RenderDetailView studio={studio} renderId={renderId} canManage={roleMay(access!.role, 'renders.create')} />;
}

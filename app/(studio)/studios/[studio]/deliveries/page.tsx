import type { Metadata } from 'next';
import { pageAccess } from '@/lib/auth/page-access';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import { DeliveriesTable } from '@/components/deliveries/deliveries-table';

export const metadata: Metadata = { title: 'Deliveries' };

/** Frame packages for show operators: every member of the studio may read them. */
export default async function DeliveriesPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { forbidden } = await pageAccess(studio, 'deliveries.read');
  if (forbidden) return <Alert tone="error" testId="forbidden">You cannot see this studio&apos;s deliveries.</Alert>;
  return (
    <div className="max-w-6xl space-y-6">
      <h1 className="text-2xl font-semibold">Deliveries</h1>
      <Panel title="Frame packages">
        <DeliveriesTable studio={studio} />
      </Panel>
    </div>
  );
}

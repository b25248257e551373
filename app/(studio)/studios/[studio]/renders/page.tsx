import type { Metadata } from 'next';
import Link from 'next/link';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import { RendersTable } from '@/components/renders/renders-table';

export const metadata: Metadata = { title: 'Renders' };

/** The studio's render queue; producers and admins may request new renders (the API enforces the same). */
export default async function RendersPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { access, forbidden } = await pageAccess(studio, 'renders.read');
  if (forbidden) {
    return (
      <Alert tone="error" testId="forbidden">
        Renders are for producers, advisors and admins. Finished frame packages are under <Link href={`/studios/${studio}/deliveries`} className="underline">Deliveries</Link>.
      </Alert>
    );
  }
  const canCreate = roleMay(access!.role, 'renders.create');
  return (
    <div className="max-w-6xl space-y-6">
      <div className="flex items-center justify-between gap-4">
        <h1 className="text-2xl font-semibold">Renders</h1>
        {canCreate ? (
          <Link href={`/studios/${studio}/renders/new`} data-testid="new-render" className="inline-flex items-center rounded-md bg-teal-500 px-3.5 py-2 text-sm font-medium text-ink-950 hover:bg-teal-400">
            New render
          </Link>
        ) : null}
      </div>
      <Panel title="Stills and frame sequences">
        <RendersTable studio={studio} />
      </Panel>
    </div>
  );
}

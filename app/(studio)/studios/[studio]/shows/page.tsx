import type { Metadata } from 'next';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { Panel } from '@/components/ui/panel';
import { ShowsList } from '@/components/scenes/lists/shows-list';

export const metadata: Metadata = { title: 'Shows' };

/** The studio's shows; admins and producers can start one. */
export default async function ShowsPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { access } = await pageAccess(studio, 'shows.read');
  const role = access!.role;
  return (
    <div className="max-w-5xl space-y-6">
      <h1 className="text-2xl font-semibold">Shows</h1>
      <Panel title="Shows in this studio">
        <ShowsList studio={studio} canWrite={roleMay(role, 'shows.write')} canOpenScenes={roleMay(role, 'scenes.read')} />
      </Panel>
    </div>
  );
}

import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { findShow } from '@/lib/scenes/service';
import { ProblemError } from '@/lib/errors';
import { Panel } from '@/components/ui/panel';
import { Alert } from '@/components/ui/alert';
import { ScenesList } from '@/components/scenes/lists/scenes-list';

export const metadata: Metadata = { title: 'Show' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** One show and its scenes. Operators see that scenes reach them through Deliveries. */
export default async function ShowPage({ params }: { params: Promise<{ studio: string; showId: string }> }) {
  const { studio, showId } = await params;
  const { access } = await pageAccess(studio, 'shows.read');
  if (!UUID.test(showId)) notFound();
  const show = await findShow(access!.studio.id, showId).catch((error) => {
    if (error instanceof ProblemError && error.status === 404) notFound();
    throw error;
  });
  const role = access!.role;
  return (
    <div className="max-w-5xl space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm text-slate-400">
        <Link href={`/studios/${studio}/shows`} className="hover:text-teal-300">Shows</Link>
        <span className="mx-2 text-slate-600">/</span>
        <span className="text-slate-300">{show.name}</span>
      </nav>
      <h1 className="text-2xl font-semibold" data-testid="show-name">{show.name}</h1>
      {show.archivedAt ? <Alert tone="caution">This show is archived: its scenes are kept, and new scenes cannot be added until it is restored.</Alert> : null}
      {roleMay(role, 'scenes.read') ? (
        <Panel title="Scenes">
          <ScenesList studio={studio} showId={show.id} canWrite={roleMay(role, 'scenes.write') && !show.archivedAt} />
        </Panel>
      ) : (
        <Alert tone="info" testId="operator-scenes-message">
          Show operators receive this show&apos;s scenes as approved frame packages under Deliveries. Scenes themselves are edited by producers and checked by
          advisors, so they are not opened here.
        </Alert>
      )}
    </div>
  );
}

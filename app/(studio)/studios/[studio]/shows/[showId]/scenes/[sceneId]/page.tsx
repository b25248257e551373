import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { ProblemError } from '@/lib/errors';
import { findScene, findShow, getRevision } from '@/lib/scenes/service';
import type { SceneSpecInput } from '@/lib/scenes/schema';
import { Alert } from '@/components/ui/alert';
import { SceneEditor } from '@/components/scenes/editor/scene-editor';

export const metadata: Metadata = { title: 'Scene editor' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function orNotFound(error: unknown): never {
  if (error instanceof ProblemError && error.status === 404) notFound();
  throw error;
}

/**
 * The scene editor. Producers and admins edit; advisors see the same editor
 * read-only; operators are told where scenes reach them.
 */
export default async function SceneEditorPage({
  params,
  searchParams,
}: {
  params: Promise<{ studio: string; showId: string; sceneId: string }>;
  searchParams: Promise<{ revision?: string }>;
}) {
  const { studio, showId, sceneId } = await params;
  const { revision: revisionParam } = await searchParams;
  const { actor, access, forbidden } = await pageAccess(studio, 'scenes.read');
  if (forbidden) {
    return (
      <div className="max-w-2xl">
        <Alert tone="info" testId="scene-forbidden">
          Show operators cannot open or edit scenes. Approved scenes reach you as frame packages under Deliveries; ask a producer if a shot needs a change.
        </Alert>
      </div>
    );
  }
  if (!UUID.test(showId) || !UUID.test(sceneId)) notFound();
  const studioId = access!.studio.id;
  const [show, scene] = await Promise.all([findShow(studioId, showId).catch(orNotFound), findScene(studioId, sceneId).catch(orNotFound)]);
  if (scene.showId !== show.id) notFound();
  const requested = Number(revisionParam);
  const number = Number.isInteger(requested) && requested >= 1 && requested <= scene.latestRevisionNumber ? requested : scene.latestRevisionNumber;
  const revision = await getRevision(studioId, scene.id, number).catch(orNotFound);
  return (
    <SceneEditor
      studio={studio}
      show={{ id: show.id, name: show.name }}
      scene={{ id: scene.id, name: scene.name, slug: scene.slug, latestRevision: scene.latestRevisionNumber }}
      revision={{ number: revision.number, createdAt: revision.createdAt, message: revision.message, spec: revision.spec as SceneSpecInput }}
      canEdit={roleMay(access!.role, 'scenes.write')}
      userId={actor.userId}
    />
  );
}

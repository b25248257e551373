import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { ProblemError } from '@/lib/errors';
import { reviewDetail } from '@/lib/reviews/service';
import { getRevision } from '@/lib/scenes/service';
import type { SceneSpec } from '@/lib/scenes/schema';
import { Alert } from '@/components/ui/alert';
import { ReviewWorkspace } from '@/components/reviews/review-workspace';
import type { ReviewDetail } from '@/components/reviews/types';

export const metadata: Metadata = { title: 'Review' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function orNotFound(error: unknown): never {
  if (error instanceof ProblemError && error.status === 404) notFound();
  throw error;
}

/** One review: advisors scrub, pin notes and decide; producers and admins read and reply. */
export default async function ReviewPage({ params }: { params: Promise<{ studio: string; reviewId: string }> }) {
  const { studio, reviewId } = await params;
  const { access, forbidden } = await pageAccess(studio, 'reviews.read');
  if (forbidden) return <Alert tone="info" testId="forbidden">Reviews are for producers and advisors.</Alert>;
  if (!UUID.test(reviewId)) notFound();
  const detail = (await reviewDetail(access!.studio.id, reviewId).catch(orNotFound)) as ReviewDetail;
  const revision = await getRevision(access!.studio.id, detail.review.sceneId, detail.review.revision).catch(orNotFound);
  // Plain JSON across the server/client boundary.
  const initial = JSON.parse(JSON.stringify(detail)) as ReviewDetail;
  return <ReviewWorkspace studio={studio} reviewId={reviewId} spec={revision.spec as SceneSpec} initial={initial} role={access!.role} />;
}

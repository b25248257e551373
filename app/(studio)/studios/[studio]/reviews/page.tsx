import type { Metadata } from 'next';
import { pageAccess } from '@/lib/auth/page-access';
import { roleMay } from '@/lib/auth/policy';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import { ReviewsList } from '@/components/reviews/reviews-list';
import { SubmitReviewForm } from '@/components/reviews/submit-review-form';

export const metadata: Metadata = { title: 'Reviews' };

/** Scene revisions in review: producers submit them, advisors open them and decide. */
export default async function ReviewsPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { access, forbidden } = await pageAccess(studio, 'reviews.read');
  if (forbidden) return <Alert tone="info" testId="forbidden">Reviews are for producers and advisors. Approved scenes reach show operators as frame packages under Deliveries.</Alert>;
  const role = access!.role;
  return (
    <div className="max-w-6xl space-y-6">
      <h1 className="text-2xl font-semibold">Reviews</h1>
      {roleMay(role, 'reviews.submit') ? (
        <Panel title="Submit for review" testId="submit-panel">
          <SubmitReviewForm studio={studio} canListMembers={roleMay(role, 'members.read')} />
        </Panel>
      ) : null}
      <Panel title="Revisions in review and decided">
        <ReviewsList studio={studio} />
      </Panel>
    </div>
  );
}

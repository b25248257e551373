import type { Metadata } from 'next';
import { pageAccess } from '@/lib/auth/page-access';
import { Alert } from '@/components/ui/alert';
import { Panel } from '@/components/ui/panel';
import { NewRenderForm } from '@/components/renders/new-render-form';

export const metadata: Metadata = { title: 'New render' };

/** Request a still or a frame sequence; producers and admins only (the API answers 403 to others). */
export default async function NewRenderPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { forbidden } = await pageAccess(studio, 'renders.create');
  if (forbidden) return <Alert tone="error" testId="forbidden">Only producers and admins request renders.</Alert>;
  return (
    <div className="max-w-4xl space-y-6">
      <h1 className="text-2xl font-semibold">New render</h1>
      <Panel title="Still or frame sequence">
        <NewRenderForm studio={studio} />
      </Panel>
    </div>
  );
}

import { pageAccess } from '@/lib/auth/page-access';
import { SkyViewStudio } from '@/components/sky-view/sky-view-studio';

export const metadata = { title: 'Sky view · Skywell' };

/** The live lensed sky for advisors and producers: WebGL with a CPU fallback. */
export default async function SkyViewPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio: slug } = await params;
  const { forbidden } = await pageAccess(slug, 'studio.read');
  if (forbidden) return <p className="text-sm text-slate-400">Your role in this studio cannot open the sky view.</p>;
  return (
    <div className="space-y-4">
      <header>
        <h1 className="text-2xl font-semibold">Sky view</h1>
        <p className="text-sm text-slate-400">What the camera sees near the hole. Drag to look around, scroll to zoom.</p>
      </header>
      <SkyViewStudio />
    </div>
  );
}

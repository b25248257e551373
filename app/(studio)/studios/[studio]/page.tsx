import { pageAccess } from '@/lib/auth/page-access';
import { navigationFor } from '@/lib/auth/navigation';
import { Panel } from '@/components/ui/panel';
import { ViewerCautions } from '@/components/studio/viewer-cautions';

export default async function StudioHome({ params }: { params: Promise<{ studio: string }> }) {
  const { studio: slug } = await params;
  const { actor, access } = await pageAccess(slug, 'studio.read');
  const sections = navigationFor(access!.role);
  return (
    <div className="max-w-4xl space-y-6">
      <h1 className="text-2xl font-semibold">Welcome, {actor.name.split(' ')[0]}</h1>
      <Panel title="What you can do here" testId="role-sections">
        <ul className="grid gap-3 sm:grid-cols-2">
          {sections.map((item) => (
            <li key={item.segment} className="rounded-md border border-ink-700 bg-ink-900/60 p-3">
              <p className="font-medium text-slate-200">{item.label}</p>
              <p className="text-sm text-slate-400">{item.purpose}</p>
            </li>
          ))}
        </ul>
      </Panel>
      <ViewerCautions />
    </div>
  );
}

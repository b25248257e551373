import type { ReactNode } from 'react';
import Link from 'next/link';
import { pageAccess } from '@/lib/auth/page-access';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { StudioNav } from '@/components/studio/studio-nav';
import { SignOutButton } from '@/components/studio/sign-out-button';

export const dynamic = 'force-dynamic';

export default async function StudioLayout({ children, params }: { children: ReactNode; params: Promise<{ studio: string }> }) {
  const { studio: slug } = await params;
  const { actor, access } = await pageAccess(slug, 'studio.read');
  const studio = access!.studio;
  return (
    <div className="flex min-h-screen">
      <aside className="w-56 shrink-0 border-r border-ink-700 bg-ink-950/60 p-4">
        <Link href="/" className="mb-6 block px-3 text-lg font-semibold tracking-wide text-slate-200">Skywell</Link>
        <StudioNav studioSlug={studio.slug} role={access!.role} />
      </aside>
      <div className="flex min-w-0 flex-1 flex-col">
        <header className="flex items-center justify-between border-b border-ink-700 px-6 py-3">
          <p className="text-sm text-slate-300">
            <span className="font-medium text-slate-200" data-testid="studio-name">{studio.name}</span>
            <span className="mx-2 text-slate-600">·</span>
            <span data-testid="current-role">{ROLE_LABELS[access!.role]}</span>
          </p>
          <div className="flex items-center gap-3 text-sm text-slate-400">
            <span data-testid="person-name">{actor.name}</span>
            <SignOutButton />
          </div>
        </header>
        <main className="flex-1 p-6">{children}</main>
      </div>
    </div>
  );
}

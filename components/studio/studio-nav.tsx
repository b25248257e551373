import Link from 'next/link';
import { navigationFor } from '@/lib/auth/navigation';
import type { Role } from '@/lib/auth/roles';

/** The studio's sections for a role; sections still being built are listed but not linked. */
export function StudioNav({ studioSlug, role }: { studioSlug: string; role: Role }) {
  return (
    <nav aria-label="Studio sections" data-testid="studio-nav">
      <ul className="space-y-1">
        <li>
          <Link href={`/studios/${studioSlug}`} className="block rounded-md px-3 py-2 text-sm text-slate-300 hover:bg-ink-700 hover:text-teal-300">Home</Link>
        </li>
        {navigationFor(role).map((item) => (
          <li key={item.segment} data-testid={`nav-${item.segment}`}>
            {item.available ? (
              <Link href={`/studios/${studioSlug}/${item.segment}`} title={item.purpose} className="block rounded-md px-3 py-2 text-sm text-slate-300 hover:bg-ink-700 hover:text-teal-300">
                {item.label}
              </Link>
            ) : (
              <span aria-disabled="true" title={`${item.purpose}: not available yet`} className="flex items-center justify-between rounded-md px-3 py-2 text-sm text-slate-500">
                {item.label}
                <span className="text-[10px] uppercase tracking-wider text-slate-600">soon</span>
              </span>
            )}
          </li>
        ))}
      </ul>
    </nav>
  );
}

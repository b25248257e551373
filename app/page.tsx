import { redirect } from 'next/navigation';
import { actorFromSession } from '@/lib/auth/actor';
import { membershipsOf } from '@/lib/auth/memberships';
import { Panel } from '@/components/ui/panel';

export const dynamic = 'force-dynamic';

/** Sends a signed-in person to their first studio. */
export default async function Home() {
  const actor = await actorFromSession();
  if (!actor) redirect('/sign-in');
  const studios = await membershipsOf(actor.userId);
  if (studios.length === 1) redirect(`/studios/${studios[0].slug}`);
  return (
    <main className="mx-auto max-w-xl p-10">
      <Panel title="Your studios">
        {studios.length === 0 ? (
          <p className="text-slate-300">You are not a member of any studio yet. Ask a studio admin to invite you.</p>
        ) : (
          <ul className="space-y-2">
            {studios.map((s) => (
              <li key={s.studioId}>
                <a className="text-teal-300 hover:underline" href={`/studios/${s.slug}`}>{s.name}</a>
                <span className="ml-2 text-sm text-slate-400">{s.role}</span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </main>
  );
}

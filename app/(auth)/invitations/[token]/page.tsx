import type { Metadata } from 'next';
import Link from 'next/link';
import { AcceptInvitationForm } from '@/components/auth/accept-invitation-form';
import { invitationState } from '@/lib/studio/invitations';
import { ROLE_LABELS } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Join a studio' };
export const dynamic = 'force-dynamic';

const DEAD_ENDS = {
  expired: { title: 'This invitation has expired', body: 'Invitation links work for a limited time. Ask the studio admin to invite you again; nothing was changed.' },
  used: { title: 'This invitation link was already used', body: 'Each link works once. If you joined already, sign in; otherwise ask the studio admin for a new invitation. Nothing was changed.' },
  unknown: { title: 'This invitation link is not valid', body: 'Check that you opened the whole link from the e-mail, or ask the studio admin for a new invitation. Nothing was changed.' },
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const state = await invitationState(token);
  if (state.state !== 'open') {
    const message = DEAD_ENDS[state.state];
    return (
      <div data-testid={`invitation-${state.state}`} className="space-y-3">
        <h1 className="text-lg font-semibold">{message.title}</h1>
        <p className="text-sm text-slate-300">{message.body}</p>
        <Link href="/sign-in" className="text-sm text-teal-300 hover:underline">Go to sign-in</Link>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">Join {state.studioName}</h1>
      <p className="text-sm text-slate-300">
        Invited as <strong className="text-slate-200">{ROLE_LABELS[state.role]}</strong> with {state.email}.
      </p>
      <AcceptInvitationForm token={token} needsPassword={state.needsPassword} />
    </div>
  );
}

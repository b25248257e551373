import type { Metadata } from 'next';
import { pageAccess } from '@/lib/auth/page-access';
import { Panel } from '@/components/ui/panel';
import { Alert } from '@/components/ui/alert';
import { InviteForm } from '@/components/studio/invite-form';
import { MembersTable } from '@/components/studio/members-table';
import { PendingInvitations, SentEmails } from '@/components/studio/sent-emails';

export const metadata: Metadata = { title: 'Studio' };

/** Members, invitations and the e-mail log; admins only (the API enforces the same). */
export default async function StudioSettingsPage({ params }: { params: Promise<{ studio: string }> }) {
  const { studio } = await params;
  const { actor, forbidden } = await pageAccess(studio, 'members.read');
  if (forbidden) return <Alert tone="error" testId="forbidden">Only studio admins manage members. Ask an admin if you need a change.</Alert>;
  return (
    <div className="max-w-5xl space-y-6">
      <h1 className="text-2xl font-semibold">Studio</h1>
      <Panel title="Invite a member"><InviteForm studio={studio} /></Panel>
      <Panel title="Members"><MembersTable studio={studio} selfEmail={actor.email} /></Panel>
      <Panel title="Open invitations"><PendingInvitations studio={studio} /></Panel>
      <Panel title="E-mail sent by Skywell"><SentEmails studio={studio} /></Panel>
    </div>
  );
}

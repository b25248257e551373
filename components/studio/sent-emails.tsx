'use client';

import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';

type Email = { id: string; kind: string; to: string; subject: string; status: 'sending' | 'sent' | 'failed'; error: string | null; sentAt: string };
type Invitation = { id: string; email: string; role: string; expiresAt: string };

const statusStyle = { sent: 'text-teal-300', sending: 'text-slate-400', failed: 'text-danger-400' } as const;

export function PendingInvitations({ studio }: { studio: string }) {
  const query = useQuery({ queryKey: ['studio', studio, 'invitations'], queryFn: () => apiFetch<{ invitations: Invitation[] }>(`/api/v1/studios/${studio}/invitations`) });
  if (query.isError) return <Alert tone="error">{query.error.message}</Alert>;
  const rows = query.data?.invitations ?? [];
  if (!rows.length) return <p className="text-sm text-slate-400">No open invitations.</p>;
  return (
    <ul className="space-y-1 text-sm" data-testid="pending-invitations">
      {rows.map((i) => (
        <li key={i.id} className="flex justify-between gap-4">
          <span>{i.email} <span className="text-slate-400">as {i.role}</span></span>
          <span className="text-slate-500">expires {new Date(i.expiresAt).toLocaleString()}</span>
        </li>
      ))}
    </ul>
  );
}

export function SentEmails({ studio }: { studio: string }) {
  const query = useQuery({ queryKey: ['studio', studio, 'emails'], queryFn: () => apiFetch<{ emails: Email[] }>(`/api/v1/studios/${studio}/emails?limit=20`) });
  if (query.isError) return <Alert tone="error">{query.error.message}</Alert>;
  const rows = query.data?.emails ?? [];
  if (!rows.length) return <p className="text-sm text-slate-400">Nothing sent yet.</p>;
  return (
    <table className="w-full text-left text-sm" data-testid="sent-emails">
      <thead className="text-slate-400"><tr><th className="py-1 pr-4 font-medium">When</th><th className="pr-4 font-medium">To</th><th className="pr-4 font-medium">Subject</th><th className="font-medium">Status</th></tr></thead>
      <tbody>
        {rows.map((e) => (
          <tr key={e.id} className="border-t border-ink-700/60">
            <td className="py-1 pr-4 text-slate-400">{new Date(e.sentAt).toLocaleString()}</td>
            <td className="pr-4">{e.to}</td>
            <td className="pr-4">{e.subject}</td>
            <td className={statusStyle[e.status]} title={e.error ?? undefined}>{e.status}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

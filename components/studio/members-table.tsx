'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { useMemo, useState } from 'react';
import { ROLES, ROLE_LABELS, type Role } from '@/lib/auth/roles';
import { apiFetch } from '@/lib/api/client';
import { Alert } from '@/components/ui/alert';

type Member = { id: string; name: string; email: string; role: Role; joinedAt: string };
const column = createColumnHelper<Member>();

export function MembersTable({ studio, selfEmail }: { studio: string; selfEmail: string }) {
  const queryClient = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const members = useQuery({ queryKey: ['studio', studio, 'members'], queryFn: () => apiFetch<{ members: Member[] }>(`/api/v1/studios/${studio}/members`) });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['studio', studio] });

  const changeRole = useMutation({
    mutationFn: ({ id, role }: { id: string; role: Role }) => apiFetch(`/api/v1/studios/${studio}/members/${id}`, { method: 'PATCH', body: { role } }),
    onMutate: () => setError(null),
    onError: (e) => setError(e.message),
    onSettled: refresh,
  });
  const remove = useMutation({
    mutationFn: (id: string) => apiFetch(`/api/v1/studios/${studio}/members/${id}`, { method: 'DELETE' }),
    onMutate: () => setError(null),
    onError: (e) => setError(e.message),
    onSettled: refresh,
  });

  const columns = useMemo(
    () => [
      column.accessor('name', { header: 'Name' }),
      column.accessor('email', { header: 'E-mail' }),
      column.accessor('role', {
        header: 'Role',
        cell: (info) => (
          <select
            aria-label={`Role of ${info.row.original.name}`}
            data-testid={`role-${info.row.original.email}`}
            className="rounded-md border border-slate-600 bg-ink-900 px-2 py-1 text-sm"
            value={info.getValue()}
            onChange={(e) => changeRole.mutate({ id: info.row.original.id, role: e.target.value as Role })}
          >
            {[...ROLES].reverse().map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
          </select>
        ),
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (info) =>
          info.row.original.email === selfEmail ? <span className="text-xs text-slate-500">you</span> : (
            <button
              type="button"
              className="text-sm text-danger-400 hover:underline"
              data-testid={`remove-${info.row.original.email}`}
              onClick={() => { if (window.confirm(`Remove ${info.row.original.name} from the studio?`)) remove.mutate(info.row.original.id); }}
            >
              Remove
            </button>
          ),
      }),
    ],
    [changeRole, remove, selfEmail],
  );
  const table = useReactTable({ data: members.data?.members ?? [], columns, getCoreRowModel: getCoreRowModel() });

  if (members.isPending) return <p className="text-sm text-slate-400">Loading members…</p>;
  if (members.isError) return <Alert tone="error">{members.error.message}</Alert>;
  return (
    <div className="space-y-3">
      {error ? <Alert tone="error" testId="members-error">{error}</Alert> : null}
      <DataTable table={table} testId="members-table" rowTestId={(m) => `member-${m.email}`} />
    </div>
  );
}

'use client';

import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { z } from 'zod';
import { ROLES, ROLE_LABELS } from '@/lib/auth/roles';
import { apiFetch, ApiError } from '@/lib/api/client';
import { Button } from '@/components/ui/button';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';

const schema = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.org.'),
  role: z.enum(ROLES),
});
type Values = z.infer<typeof schema>;
type InviteResult = { invitation: { email: string }; emailError: string | null };

export function InviteForm({ studio }: { studio: string }) {
  const queryClient = useQueryClient();
  const [outcome, setOutcome] = useState<{ tone: 'info' | 'error'; text: string } | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { role: 'producer' } });

  const mutation = useMutation({
    mutationFn: (values: Values) => apiFetch<InviteResult>(`/api/v1/studios/${studio}/invitations`, { method: 'POST', body: values }),
    onSuccess: (result) => {
      setOutcome(
        result.emailError
          ? { tone: 'error', text: `The invitation was saved but the e-mail could not be sent (${result.emailError}). Invite again to resend.` }
          : { tone: 'info', text: `Invitation sent to ${result.invitation.email}.` },
      );
      reset({ email: '', role: 'producer' });
      queryClient.invalidateQueries({ queryKey: ['studio', studio] });
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const f of error.fieldErrors) if (f.field === 'email' || f.field === 'role') setError(f.field, { message: f.message });
      setOutcome({ tone: 'error', text: error.message });
    },
  });

  return (
    <form onSubmit={handleSubmit((v) => mutation.mutate(v))} className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end" noValidate data-testid="invite-form">
      <Field id="invite-email" label="E-mail" error={formState.errors.email?.message}>
        <TextInput id="invite-email" type="email" autoComplete="off" invalid={!!formState.errors.email} {...register('email')} />
      </Field>
      <Field id="invite-role" label="Role" error={formState.errors.role?.message}>
        <Select id="invite-role" {...register('role')}>
          {[...ROLES].reverse().map((role) => <option key={role} value={role}>{ROLE_LABELS[role]}</option>)}
        </Select>
      </Field>
      <Button type="submit" disabled={mutation.isPending}>{mutation.isPending ? 'Sending…' : 'Send invitation'}</Button>
      {outcome ? <div className="sm:col-span-3"><Alert tone={outcome.tone} testId="invite-outcome">{outcome.text}</Alert></div> : null}
    </form>
  );
}

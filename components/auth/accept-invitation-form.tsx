'use client';

import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';
import { apiFetch, ApiError } from '@/lib/api/client';

const MIN = 10;

function schemaFor(needsPassword: boolean) {
  if (!needsPassword) return z.object({ name: z.string().optional(), password: z.string().optional(), confirm: z.string().optional() });
  return z
    .object({
      name: z.string().trim().min(1, 'Enter your name.').max(120),
      password: z.string().min(MIN, `Use at least ${MIN} characters.`).max(200),
      confirm: z.string(),
    })
    .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
}

export function AcceptInvitationForm({ token, needsPassword }: { token: string; needsPassword: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<{ name?: string; password?: string; confirm?: string }>({ resolver: zodResolver(schemaFor(needsPassword)) });

  async function onSubmit(values: { name?: string; password?: string }) {
    setError(null);
    try {
      await apiFetch('/api/v1/invitations/accept', { method: 'POST', body: needsPassword ? { token, name: values.name, password: values.password } : { token } });
      router.replace('/sign-in?joined=1');
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach Skywell; check your connection and try again.');
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate data-testid="accept-invitation-form">
      {error ? <Alert tone="error">{error}</Alert> : null}
      {needsPassword ? (
        <>
          <Field id="name" label="Your name" error={formState.errors.name?.message}>
            <TextInput id="name" autoComplete="name" autoFocus invalid={!!formState.errors.name} {...register('name')} />
          </Field>
          <Field id="password" label={`New password (at least ${MIN} characters)`} error={formState.errors.password?.message}>
            <TextInput id="password" type="password" autoComplete="new-password" invalid={!!formState.errors.password} {...register('password')} />
          </Field>
          <Field id="confirm" label="Repeat the password" error={formState.errors.confirm?.message}>
            <TextInput id="confirm" type="password" autoComplete="new-password" invalid={!!formState.errors.confirm} {...register('confirm')} />
          </Field>
        </>
      ) : (
        <p className="text-sm text-slate-300">You already have a Skywell account; joining keeps your current password.</p>
      )}
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {needsPassword ? 'Set password and join' : 'Join the studio'}
      </Button>
    </form>
  );
}

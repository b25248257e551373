'use client';

import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { useEffect, useState } from 'react';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';

const schema = z.object({
  email: z.string().trim().email('Enter the e-mail address you were invited with.'),
  password: z.string().min(1, 'Enter your password.'),
});
type Values = z.infer<typeof schema>;

const MESSAGES: Record<string, string> = {
  invalid: 'That e-mail and password do not match an account.',
  throttled: 'Too many failed attempts. Wait 15 minutes and try again, or ask a studio admin for a new invitation.',
};

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(params.get('error') ? MESSAGES.invalid : null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema) });
  // Lets tests (and impatient people) know the form is interactive: before hydration a submit would be a plain GET.
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);

  async function onSubmit(values: Values) {
    setError(null);
    const result = await signIn('credentials', { ...values, redirect: false });
    if (!result || result.error) {
      setError(MESSAGES[result?.error ?? 'invalid'] ?? MESSAGES.invalid);
      return;
    }
    const next = params.get('callbackUrl');
    router.replace(next && next.startsWith('/') ? next : '/');
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} method="post" className="space-y-4" noValidate data-testid="sign-in-form" data-hydrated={hydrated}>
      {params.get('joined') ? <Alert>Your account is ready. Sign in with your new password.</Alert> : null}
      {error ? <Alert tone="error" testId="sign-in-error">{error}</Alert> : null}
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <TextInput id="email" type="email" autoComplete="username" autoFocus invalid={!!formState.errors.email} {...register('email')} />
      </Field>
      <Field id="password" label="Password" error={formState.errors.password?.message}>
        <TextInput id="password" type="password" autoComplete="current-password" invalid={!!formState.errors.password} {...register('password')} />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}

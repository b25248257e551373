import type { Metadata } from 'next';
import { Suspense } from 'react';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/components/auth/sign-in-form';
import { actorFromSession } from '@/lib/auth/actor';

export const metadata: Metadata = { title: 'Sign in' };
export const dynamic = 'force-dynamic';

export default async function SignInPage() {
  if (await actorFromSession()) redirect('/');
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
      <Suspense>
        <SignInForm />
      </Suspense>
    </>
  );
}

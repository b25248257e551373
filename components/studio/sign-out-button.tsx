'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: '/sign-in' })} className="rounded-md px-2 py-1 text-sm text-slate-400 hover:text-teal-300" data-testid="sign-out">
      Sign out
    </button>
  );
}

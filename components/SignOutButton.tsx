'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button type="button" className="text-sm text-ink-soft underline-offset-2 hover:text-ink hover:underline" onClick={() => signOut({ callbackUrl: '/sign-in' })}>
      Sign out
    </button>
  );
}

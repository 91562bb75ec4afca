'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';

export function SignInForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn('credentials', {
      email: String(form.get('email') ?? ''),
      password: String(form.get('password') ?? ''),
      redirect: false,
    });
    setBusy(false);
    if (!result || result.error) {
      setError(result?.error && result.error !== 'CredentialsSignin' ? result.error : 'E-mail or password not recognised.');
      return;
    }
    router.replace('/');
    router.refresh();
  }

  return (
    <form method="post" onSubmit={onSubmit} className="space-y-4" noValidate>
      <label className="block">
        <span className="field-label">E-mail</span>
        <input name="email" type="email" autoComplete="username" required className="field-input" />
      </label>
      <label className="block">
        <span className="field-label">Password</span>
        <input name="password" type="password" autoComplete="current-password" required className="field-input" />
      </label>
      {error && (
        <p role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">
          {error}
        </p>
      )}
      <SubmitButton className="btn-primary w-full justify-center" busy={busy}>
        {busy ? 'Signing in…' : 'Sign in'}
      </SubmitButton>
    </form>
  );
}

import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/components/SignInForm';
import { actorFromSession } from '@/lib/auth/actor';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await actorFromSession()) redirect('/');
  return (
    <div className="panel p-6 shadow-sm">
      <h1 className="mb-4 text-base font-semibold">Sign in</h1>
      <SignInForm />
    </div>
  );
}

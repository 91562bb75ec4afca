import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { PlumeMark } from '@/components/PlumeMark';
import { SignInForm } from '@/components/SignInForm';
import { actorFromSession } from '@/lib/auth/actor';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await actorFromSession()) redirect('/');
  return (
    <main className="flex min-h-screen items-center justify-center bg-surface-sunken px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-2">
          <PlumeMark className="h-8 w-8" />
          <div>
            <div className="text-lg font-semibold tracking-tight">Plumeward</div>
            <div className="text-xs text-ink-soft">Steam-trap survey workbench</div>
          </div>
        </div>
        <div className="panel p-6 shadow-sm">
          <h1 className="mb-4 text-base font-semibold">Sign in</h1>
          <SignInForm />
        </div>
      </div>
    </main>
  );
}

import type { Metadata } from 'next';
import { invitationForToken } from '@/lib/services/invitations';
import { acceptInvitationAction } from './actions';

export const metadata: Metadata = { title: 'Accept invitation' };
export const dynamic = 'force-dynamic';

const SAID: Record<string, { title: string; text: string }> = {
  accepted: { title: 'This invitation has already been used', text: 'Sign in with the password chosen when it was used. If that was not you, tell an admin.' },
  expired: { title: 'This invitation has expired', text: 'Invitation links work for a limited time. Ask an admin to send a new one.' },
  revoked: { title: 'This invitation was replaced', text: 'A newer invitation was sent to the same address. Use the link in the latest e-mail.' },
  unknown: { title: 'This link is not valid', text: 'Check that the whole link was copied from the e-mail, or ask an admin for a new invitation.' },
};

export default async function InvitationPage({ params, searchParams }: { params: Promise<{ token: string }>; searchParams: Promise<{ problem?: string }> }) {
  const { token } = await params;
  const { problem } = await searchParams;
  const invitation = await invitationForToken(token);
  const refused = invitation.state !== 'pending' ? SAID[invitation.state] : null;
  return (
    <>
    <div className="panel p-6 shadow-sm" data-testid="invitation" data-state={invitation.state}>
      {refused ? (
        <>
          <h1 className="mb-2 text-base font-semibold">{refused.title}</h1>
          <p className="text-sm text-ink-soft">{refused.text}</p>
          <p className="mt-4 text-sm"><a className="text-accent-700 hover:underline" href="/sign-in">Go to sign-in</a></p>
        </>
      ) : (
        <>
          <h1 className="mb-1 text-base font-semibold">Welcome, {invitation.name}</h1>
          <p className="mb-4 text-sm text-ink-soft">You are invited as {invitation.role?.toLowerCase()} with {invitation.email}. Choose a password to finish; you then sign in with it.</p>
          <form action={acceptInvitationAction} className="space-y-3">
            <input type="hidden" name="token" value={token} />
            <label className="block"><span className="field-label">Password (at least 10 characters)</span><input name="password" type="password" required minLength={10} autoComplete="new-password" className="field-input" /></label>
            <label className="block"><span className="field-label">The same again</span><input name="confirm" type="password" required minLength={10} autoComplete="new-password" className="field-input" /></label>
            {problem && <p role="alert" className="field-error">{problem}</p>}
            <button type="submit" className="btn-primary w-full justify-center">Set password</button>
          </form>
        </>
      )}
    </div>
    </>
  );
}

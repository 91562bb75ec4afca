'use server';

import { redirect } from 'next/navigation';
import { invitationAcceptSchema } from '@/lib/api/work-order-routes';
import { AppError } from '@/lib/http/errors';
import { acceptInvitation } from '@/lib/services/invitations';

// The one server action outside defineAction: the invitee has no session yet. The token in the
// form is the credential (single use, expiring, checked against its stored hash by the service),
// as the password is for sign-in. The form works without JavaScript; the outcome is a redirect.
export async function acceptInvitationAction(form: FormData) {
  const token = String(form.get('token') ?? '');
  const parsed = invitationAcceptSchema.safeParse({ token, password: form.get('password'), confirm: form.get('confirm') });
  const back = (problem: string) => redirect(`/invitations/${encodeURIComponent(token)}?problem=${encodeURIComponent(problem)}`);
  if (!parsed.success) back(parsed.error.issues[0]?.message ?? 'Check the password.');
  let email: string;
  try {
    ({ email } = await acceptInvitation(parsed.data!.token, parsed.data!.password));
  } catch (err) {
    if (err instanceof AppError) back(err.message);
    throw err;
  }
  redirect(`/sign-in?invited=${encodeURIComponent(email!)}`);
}

import 'server-only';
import { cookies } from 'next/headers';
import { decode, type JWT } from 'next-auth/jwt';
import type { Role } from '@/lib/domain/vocabulary';
import { activeUser } from './current-user';
import { authSecret } from './secret';

/** One working day in the plant, then sign in again. */
export const SESSION_HOURS = 10;

/** The user a session stands for, as the database says now. */
export type SessionUser = { userId: number; name: string; email: string; role: Role; siteIds: number[] | 'all' };

/**
 * The user of a session token; null once the working day since the sign-in is over (next-auth
 * renews the cookie's expiry whenever it re-issues it, so a page left polling would otherwise stay
 * signed in for ever), or when the user is disabled or gone. Role and sites come from the
 * database on every call, never from the token, so a change made by an admin shows at once.
 */
export async function sessionUser(token: JWT): Promise<SessionUser | null> {
  const signedInAt = typeof token.signedInAt === 'number' ? token.signedInAt : 0;
  if (Date.now() / 1000 - signedInAt > SESSION_HOURS * 3600) return null;
  const userId = Number(token.uid);
  if (!Number.isInteger(userId) || userId <= 0) return null;
  const current = await activeUser(userId);
  if (!current) return null;
  return { userId, name: current.user.name, email: current.user.email, role: current.role, siteIds: current.siteIds };
}

/** next-auth's session cookie: __Secure- prefixed when the app is served over https (next-auth core/lib/cookie.js). */
const cookieName = () => `${process.env.NEXTAUTH_URL?.startsWith('https://') ? '__Secure-' : ''}next-auth.session-token`;

/**
 * The token of this request's session cookie as next-auth issued it; null when there is none, or
 * it is tampered with or expired. Read only: unlike getServerSession, which encrypts and sets the
 * cookie anew on every call, this leaves the cookie alone — its expiry could not outlast the
 * working day from the sign-in anyway (session.maxAge is that day).
 */
export async function sessionToken(): Promise<JWT | null> {
  const store = await cookies();
  const name = cookieName();
  let value = store.get(name)?.value;
  if (!value) {
    // A large token is split into name.0, name.1, … (next-auth core/lib/cookie.js SessionStore).
    const index = (n: string) => Number(n.slice(name.length + 1));
    const chunks = store.getAll().filter((c) => c.name.startsWith(`${name}.`) && Number.isInteger(index(c.name)));
    value = chunks.sort((a, b) => index(a.name) - index(b.name)).map((c) => c.value).join('');
  }
  if (!value) return null;
  try {
    return await decode({ token: value, secret: authSecret() });
  } catch {
    return null;
  }
}

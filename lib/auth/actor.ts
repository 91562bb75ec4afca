import 'server-only';
import type { Role } from '@/lib/domain/vocabulary';
import { AppError } from '@/lib/http/errors';
import { writeTransaction } from '@/lib/db';
import { ApiToken } from '@/models';
import { activeUser } from './current-user';
import { sessionToken, sessionUser } from './session';
import { hashToken } from './tokens';

/** Who is acting, as the database says now (never as a session cookie remembers it). */
export type Actor = {
  userId: number;
  name: string;
  email: string;
  role: Role;
  via: 'session' | 'token';
  /** True for a read-only API token: every write is refused. */
  readOnly: boolean;
  /** The sites this actor may see: 'all' for an admin signed in, otherwise a list of ids. */
  siteIds: number[] | 'all';
  tokenId?: number;
};

/** The actor of the session cookie; null when signed out, expired, disabled or deleted. */
export async function actorFromSession(): Promise<Actor | null> {
  const token = await sessionToken();
  const user = token && (await sessionUser(token));
  if (!user) return null;
  return { ...user, via: 'session', readOnly: false };
}

async function actorFromToken(secret: string): Promise<Actor> {
  const token = await ApiToken.findOne({ where: { tokenHash: hashToken(secret) } });
  if (!token || token.revokedAt) throw new AppError('unauthenticated', 'API token not recognised or revoked.');
  const found = await activeUser(token.userId);
  if (!found) throw new AppError('unauthenticated', 'The owner of this API token is disabled.');
  const { user, siteIds } = found;
  const limited = token.siteIds;
  const scoped = limited ? (siteIds === 'all' ? limited : siteIds.filter((id) => limited.includes(id))) : siteIds;
  // "Last used" to the minute is enough, and spares a write on every scripted call.
  if (!token.lastUsedAt || Date.now() - token.lastUsedAt.getTime() > 60_000) {
    await writeTransaction((transaction) => token.update({ lastUsedAt: new Date() }, { silent: true, transaction }));
  }
  return {
    userId: user.id, name: user.name, email: user.email, role: user.role,
    via: 'token', readOnly: token.readOnly, siteIds: scoped, tokenId: token.id,
  };
}

/**
 * The actor of a request: a bearer token when the request carries one (scripts), else the session
 * cookie (the app). A bearer header that does not check out is an error, not a fall-back to the cookie.
 */
export async function actorFromRequest(request: Request): Promise<Actor | null> {
  const header = request.headers.get('authorization');
  if (header) {
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    if (!match) throw new AppError('unauthenticated', 'Authorization header must be "Bearer <token>".');
    return actorFromToken(match[1]);
  }
  return actorFromSession();
}

export function canSeeSite(actor: Actor, siteId: number): boolean {
  return actor.siteIds === 'all' || actor.siteIds.includes(siteId);
}

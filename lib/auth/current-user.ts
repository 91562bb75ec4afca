import 'server-only';
import type { Role } from '@/lib/domain/vocabulary';
import { SiteMembership, User } from '@/models';

/** The sites a user belongs to: 'all' for an admin. */
export async function siteIdsOf(user: Pick<User, 'id' | 'role'>): Promise<number[] | 'all'> {
  if (user.role === 'admin') return 'all';
  const memberships = await SiteMembership.findAll({ where: { userId: user.id }, attributes: ['siteId'] });
  return memberships.map((m) => m.siteId);
}

/** An active user as stored now, with their sites; null when disabled or gone. */
export async function activeUser(userId: number): Promise<{ user: User; role: Role; siteIds: number[] | 'all' } | null> {
  // Read on every signed-in request: the columns an actor needs, not the password hash and stamps.
  const user = await User.findByPk(userId, { attributes: ['id', 'name', 'email', 'role', 'status'] });
  if (!user || user.status !== 'active') return null;
  return { user, role: user.role, siteIds: await siteIdsOf(user) };
}

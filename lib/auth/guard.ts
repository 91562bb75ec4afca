import 'server-only';
import { AppError, notFound } from '@/lib/http/errors';
import { Site } from '@/models';
import { canSeeSite, type Actor } from './actor';
import { isWrite, roleMay, type Permission } from './permissions';

/** Role and token scope: 403 when the actor may not do this anywhere. */
export function assertPermission(actor: Actor, permission: Permission): void {
  if (!roleMay(actor.role, permission)) {
    throw new AppError('forbidden', `Your role (${actor.role}) may not do this.`);
  }
  if (actor.readOnly && isWrite(permission)) {
    throw new AppError('forbidden', 'This API token is read-only.');
  }
}

/** Site scope: a site the actor does not belong to answers 404, as if it did not exist. */
export async function assertSiteAccess(actor: Actor, siteId: number | null | undefined, what = 'record'): Promise<number> {
  if (siteId == null || !canSeeSite(actor, siteId)) throw notFound(what);
  if (actor.siteIds === 'all' && !(await Site.findByPk(siteId, { attributes: ['id'] }))) throw notFound(what);
  return siteId;
}

import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { actorFromSession, canSeeSite, type Actor } from './actor';
import { roleMay, type Permission } from './permissions';

/** For pages: the signed-in actor, or a redirect to sign-in. */
export async function requireActor(): Promise<Actor> {
  const actor = await actorFromSession();
  if (!actor) redirect('/sign-in');
  return actor;
}

/** For pages under /sites/[siteId]: the actor, when they may see this site; a 404 page otherwise. */
export async function requireSiteActor(rawSiteId: string, permission: Permission = 'site.read'): Promise<{ actor: Actor; siteId: number }> {
  const actor = await requireActor();
  const siteId = Number(rawSiteId);
  if (!Number.isInteger(siteId) || siteId <= 0 || !canSeeSite(actor, siteId)) notFound();
  if (!roleMay(actor.role, permission)) notFound();
  return { actor, siteId };
}

/** For pages only some roles may open (settings): other roles get a 404 page. */
export async function requirePermission(permission: Permission): Promise<Actor> {
  const actor = await requireActor();
  if (!roleMay(actor.role, permission)) notFound();
  return actor;
}

/** Whether to show a control: a courtesy only, the server decides again on submit. */
export const may = (actor: Actor, permission: Permission) => roleMay(actor.role, permission);

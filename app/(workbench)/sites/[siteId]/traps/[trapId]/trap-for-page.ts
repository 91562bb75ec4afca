import 'server-only';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/http/errors';
import { getTrap } from '@/lib/services/traps';

/** The trap of a /sites/[siteId]/traps/[trapId] page, or the 404 page when it is not of this site. */
export async function trapForPage(siteId: number, rawTrapId: string) {
  const trapId = Number(rawTrapId);
  if (!Number.isInteger(trapId) || trapId <= 0) notFound();
  try {
    const trap = await getTrap(trapId);
    if (trap.siteId !== siteId) notFound();
    return trap;
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound();
    throw err;
  }
}

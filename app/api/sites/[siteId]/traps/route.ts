import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { siteDataVersion } from '@/lib/services/derived-cache';
import { createTrap, listTraps } from '@/lib/services/traps';

export const GET = apiRoute(ROUTES.listTraps, {
  site: ({ params }) => params.siteId,
  keep: ({ params }) => siteDataVersion(params.siteId),
  handle: ({ params, query }) => listTraps(params.siteId, query),
});

export const POST = apiRoute(ROUTES.createTrap, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => createTrap(actor, params.siteId, body),
});

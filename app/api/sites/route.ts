import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createSite, listSitesFor } from '@/lib/services/sites';

export const GET = apiRoute(ROUTES.listSites, {
  handle: async ({ actor }) => ({ items: await listSitesFor(actor) }),
});

export const POST = apiRoute(ROUTES.createSite, {
  handle: ({ actor, body }) => createSite(actor, body),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createArea, listAreas } from '@/lib/services/areas';

export const GET = apiRoute(ROUTES.listAreas, {
  site: ({ params }) => params.siteId,
  handle: async ({ params }) => ({ items: await listAreas(params.siteId) }),
});

export const POST = apiRoute(ROUTES.createArea, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => createArea(actor, params.siteId, body),
});

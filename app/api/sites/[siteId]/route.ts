import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getSite, updateSite } from '@/lib/services/sites';

export const GET = apiRoute(ROUTES.getSite, {
  site: ({ params }) => params.siteId,
  handle: ({ params }) => getSite(params.siteId),
});

export const PATCH = apiRoute(ROUTES.updateSite, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => updateSite(actor, params.siteId, body),
});

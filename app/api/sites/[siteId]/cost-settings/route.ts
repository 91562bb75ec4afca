import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getCostSettings, updateCostSettings } from '@/lib/services/outcomes';

export const GET = apiRoute(ROUTES.getCostSettings, {
  site: ({ params }) => params.siteId,
  handle: ({ params }) => getCostSettings(params.siteId),
});

export const PUT = apiRoute(ROUTES.updateCostSettings, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => updateCostSettings(actor, params.siteId, body),
});

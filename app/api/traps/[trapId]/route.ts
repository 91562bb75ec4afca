import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getTrap, siteIdOfTrap, updateTrap } from '@/lib/services/traps';

export const GET = apiRoute(ROUTES.getTrap, {
  site: ({ params }) => siteIdOfTrap(params.trapId),
  handle: ({ params }) => getTrap(params.trapId),
});

export const PATCH = apiRoute(ROUTES.updateTrap, {
  site: ({ params }) => siteIdOfTrap(params.trapId),
  handle: ({ actor, params, body }) => updateTrap(actor, params.trapId, body),
});

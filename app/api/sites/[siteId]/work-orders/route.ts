import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listWorkOrders } from '@/lib/services/work-orders';

export const GET = apiRoute(ROUTES.listWorkOrders, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, query }) => listWorkOrders(actor, params.siteId, query),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getWorkOrder, siteIdOfWorkOrder, updateWorkOrder } from '@/lib/services/work-orders';

export const GET = apiRoute(ROUTES.getWorkOrder, {
  site: ({ params }) => siteIdOfWorkOrder(params.workOrderId),
  handle: ({ params }) => getWorkOrder(params.workOrderId),
});

export const PATCH = apiRoute(ROUTES.updateWorkOrder, {
  site: ({ params }) => siteIdOfWorkOrder(params.workOrderId),
  handle: ({ actor, params, body }) => updateWorkOrder(actor, params.workOrderId, body),
});

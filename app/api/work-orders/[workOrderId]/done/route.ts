import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { completeWorkOrder, siteIdOfWorkOrder } from '@/lib/services/work-orders';

export const POST = apiRoute(ROUTES.completeWorkOrder, {
  site: ({ params }) => siteIdOfWorkOrder(params.workOrderId),
  handle: ({ actor, params, body }) => completeWorkOrder(actor, params.workOrderId, body),
});

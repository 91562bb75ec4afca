import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { siteIdOfSurvey } from '@/lib/services/surveys';
import { createWorkOrders } from '@/lib/services/work-orders';

export const POST = apiRoute(ROUTES.createWorkOrders, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ actor, params, body }) => createWorkOrders(actor, params.surveyId, body),
});

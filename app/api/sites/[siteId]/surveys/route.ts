import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createSurvey, listSurveys } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.listSurveys, {
  site: ({ params }) => params.siteId,
  handle: async ({ params }) => ({ items: await listSurveys(params.siteId) }),
});

export const POST = apiRoute(ROUTES.createSurvey, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => createSurvey(actor, params.siteId, body),
});

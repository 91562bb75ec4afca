import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listedFailures, publishSurvey } from '@/lib/services/outcomes';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const POST = apiRoute(ROUTES.publishSurvey, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: async ({ actor, params, body }) => listedFailures(await publishSurvey(actor, params.surveyId, body.acceptUndecided), 20),
});

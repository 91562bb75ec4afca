import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { publishSurvey } from '@/lib/services/outcomes';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const POST = apiRoute(ROUTES.publishSurvey, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ actor, params, body }) => publishSurvey(actor, params.surveyId, body.acceptUndecided),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { decideVerdict } from '@/lib/services/review';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const POST = apiRoute(ROUTES.decideVerdict, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ actor, params, body }) => decideVerdict(actor, params.surveyId, body),
});

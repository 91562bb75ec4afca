import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { reviewQueue } from '@/lib/services/review';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.reviewQueue, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ params, query }) => reviewQueue(params.surveyId, query),
});

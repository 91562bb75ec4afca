import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { surveyDataVersion } from '@/lib/services/derived-cache';
import { reviewQueue } from '@/lib/services/review';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.reviewQueue, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  keep: ({ params }) => surveyDataVersion(params.surveyId),
  handle: ({ params, query }) => reviewQueue(params.surveyId, query),
});

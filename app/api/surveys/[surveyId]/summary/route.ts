import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { surveySummary } from '@/lib/services/outcomes';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.surveySummary, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ params }) => surveySummary(params.surveyId),
});

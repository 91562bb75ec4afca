import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { surveyDataVersion } from '@/lib/services/derived-cache';
import { listedFailures, surveySummary } from '@/lib/services/outcomes';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.surveySummary, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  keep: ({ params }) => surveyDataVersion(params.surveyId),
  handle: async ({ params, query }) => listedFailures(await surveySummary(params.surveyId), query.failures),
});

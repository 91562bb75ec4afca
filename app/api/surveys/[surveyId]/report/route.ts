import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { surveyReport } from '@/lib/reports/survey-report';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.surveyReport, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ params, query }) => surveyReport(params.surveyId, query.format, query.table),
});

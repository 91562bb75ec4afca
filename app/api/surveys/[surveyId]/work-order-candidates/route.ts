import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { siteIdOfSurvey } from '@/lib/services/surveys';
import { workOrderCandidates } from '@/lib/services/work-orders';

export const GET = apiRoute(ROUTES.workOrderCandidates, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ params }) => workOrderCandidates(params.surveyId),
});

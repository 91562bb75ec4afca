import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { fieldWork } from '@/lib/services/field-notes';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const GET = apiRoute(ROUTES.fieldWork, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ actor, params }) => fieldWork(actor, params.surveyId),
});

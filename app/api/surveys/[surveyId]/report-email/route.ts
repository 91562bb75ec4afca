import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { emailSurveyReport } from '@/lib/services/report-mail';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const POST = apiRoute(ROUTES.emailSurveyReport, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: ({ actor, params }) => emailSurveyReport(actor, params.surveyId),
});

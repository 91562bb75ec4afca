import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { addFieldPhoto, siteIdOfSurveyTrap } from '@/lib/services/field-notes';

// Authorised before a byte of the body is read: the survey and trap are in the path.
export const POST = apiRoute(ROUTES.uploadFieldNotePhoto, {
  site: ({ params }) => siteIdOfSurveyTrap(params.surveyId, params.trapId),
  handle: ({ actor, params, request }) => addFieldPhoto(actor, params.surveyId, params.trapId, request),
});

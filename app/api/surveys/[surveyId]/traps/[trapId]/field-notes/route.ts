import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createFieldNote, listTrapFieldNotes, siteIdOfSurveyTrap } from '@/lib/services/field-notes';

export const GET = apiRoute(ROUTES.listTrapFieldNotes, {
  site: ({ params }) => siteIdOfSurveyTrap(params.surveyId, params.trapId),
  handle: ({ actor, params }) => listTrapFieldNotes(actor, params.surveyId, params.trapId),
});

export const POST = apiRoute(ROUTES.createFieldNote, {
  site: ({ params }) => siteIdOfSurveyTrap(params.surveyId, params.trapId),
  handle: ({ actor, params, body }) => createFieldNote(actor, params.surveyId, params.trapId, body),
});

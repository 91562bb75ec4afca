import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { deleteFieldNote, siteIdOfSurveyNote } from '@/lib/services/field-notes';

export const DELETE = apiRoute(ROUTES.deleteFieldNote, {
  site: ({ params }) => siteIdOfSurveyNote(params.surveyId, params.noteId),
  handle: ({ actor, params }) => deleteFieldNote(actor, params.surveyId, params.noteId),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { fieldNotePhoto, siteIdOfSurveyNote } from '@/lib/services/field-notes';

export const GET = apiRoute(ROUTES.getFieldNotePhoto, {
  site: ({ params }) => siteIdOfSurveyNote(params.surveyId, params.noteId),
  handle: ({ params }) => fieldNotePhoto(params.surveyId, params.noteId),
});

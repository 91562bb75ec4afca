import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { kickImportWorker } from '@/lib/server/import-worker';
import { receiveUpload } from '@/lib/server/receive-upload';
import { siteIdOfSurvey } from '@/lib/services/surveys';
import { createUpload } from '@/lib/services/uploads';

// Authorised before a byte of the body is read: the survey's site is in the path.
export const POST = apiRoute(ROUTES.createUpload, {
  site: ({ params }) => siteIdOfSurvey(params.surveyId),
  handle: async ({ actor, params, request }) => {
    const files = await receiveUpload(request);
    const upload = await createUpload(actor, params.surveyId, files);
    kickImportWorker();
    return upload;
  },
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { saveMappingDraft, siteIdOfUpload } from '@/lib/services/uploads';

export const PUT = apiRoute(ROUTES.saveMappingDraft, {
  site: ({ params }) => siteIdOfUpload(params.uploadId),
  handle: ({ actor, params, body }) => saveMappingDraft(actor, params.uploadId, body),
});

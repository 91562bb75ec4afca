import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { applyProfileToUpload } from '@/lib/services/upload-mapping';
import { siteIdOfUpload } from '@/lib/services/uploads';

export const POST = apiRoute(ROUTES.applyProfileToUpload, {
  site: ({ params }) => siteIdOfUpload(params.uploadId),
  handle: ({ actor, params, body }) => applyProfileToUpload(actor, params.uploadId, body.profileId, body.reprocess),
});

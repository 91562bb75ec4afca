import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { decideUploadTag } from '@/lib/services/upload-mapping';
import { siteIdOfUpload } from '@/lib/services/uploads';

export const POST = apiRoute(ROUTES.decideUploadTag, {
  site: ({ params }) => siteIdOfUpload(params.uploadId),
  handle: ({ actor, params, body }) => decideUploadTag(actor, params.uploadId, body),
});

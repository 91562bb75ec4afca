import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { previewMapping } from '@/lib/services/mapping-preview';
import { siteIdOfUpload } from '@/lib/services/uploads';

export const POST = apiRoute(ROUTES.previewMapping, {
  site: ({ params }) => siteIdOfUpload(params.uploadId),
  handle: ({ params, body }) => previewMapping(params.uploadId, body.fileId, body.profile),
});

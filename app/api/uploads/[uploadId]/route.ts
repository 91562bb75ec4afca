import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getUpload, siteIdOfUpload } from '@/lib/services/uploads';

export const GET = apiRoute(ROUTES.getUpload, {
  site: ({ params }) => siteIdOfUpload(params.uploadId),
  handle: ({ params }) => getUpload(params.uploadId),
});

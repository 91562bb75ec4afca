import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listUploads } from '@/lib/services/uploads';

export const GET = apiRoute(ROUTES.listUploads, {
  site: ({ params }) => params.siteId,
  handle: async ({ params }) => ({ items: await listUploads(params.siteId) }),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listTests } from '@/lib/services/tests';

export const GET = apiRoute(ROUTES.listTests, {
  site: ({ params }) => params.siteId,
  handle: ({ params, query }) => listTests(params.siteId, query),
});

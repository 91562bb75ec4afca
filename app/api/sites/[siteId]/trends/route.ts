import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { siteTrends } from '@/lib/services/outcomes';

export const GET = apiRoute(ROUTES.siteTrends, {
  site: ({ params }) => params.siteId,
  handle: ({ params }) => siteTrends(params.siteId),
});

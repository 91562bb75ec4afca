import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { trapHistory } from '@/lib/services/review';
import { siteIdOfTrap } from '@/lib/services/traps';

export const GET = apiRoute(ROUTES.trapHistory, {
  site: ({ params }) => siteIdOfTrap(params.trapId),
  handle: async ({ params }) => ({ items: await trapHistory(params.trapId) }),
});

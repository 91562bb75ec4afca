import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getSeries, siteIdOfTest } from '@/lib/services/tests';

export const GET = apiRoute(ROUTES.getTestSeries, {
  site: ({ params }) => siteIdOfTest(params.testId),
  handle: ({ params, query }) => getSeries(params.testId, query),
});

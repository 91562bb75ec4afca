import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { testDetail } from '@/lib/services/review';
import { siteIdOfTest } from '@/lib/services/tests';

export const GET = apiRoute(ROUTES.getTest, {
  site: ({ params }) => siteIdOfTest(params.testId),
  handle: ({ params }) => testDetail(params.testId),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { surveyRowsVersion } from '@/lib/services/derived-cache';
import { listTests } from '@/lib/services/tests';

export const GET = apiRoute(ROUTES.listTests, {
  site: ({ params }) => params.siteId,
  // A survey's tests are what its rows' version counts; the lists of a whole site or an upload alone are made afresh.
  keep: async ({ query }) => (query.surveyId === undefined ? null : surveyRowsVersion(query.surveyId)),
  handle: ({ params, query }) => listTests(params.siteId, query),
});

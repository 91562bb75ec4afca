import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listTestFieldNotes } from '@/lib/services/field-notes';
import { siteIdOfTest } from '@/lib/services/tests';

export const GET = apiRoute(ROUTES.listTestFieldNotes, {
  site: ({ params }) => siteIdOfTest(params.testId),
  handle: ({ actor, params }) => listTestFieldNotes(actor, params.testId),
});

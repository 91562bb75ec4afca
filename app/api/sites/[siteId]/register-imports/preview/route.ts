import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { planRegisterImport, publicPlan } from '@/lib/services/register-import';

export const POST = apiRoute(ROUTES.previewRegisterImport, {
  site: ({ params }) => params.siteId,
  handle: async ({ params, body }) => publicPlan(await planRegisterImport(params.siteId, body.csv)),
});

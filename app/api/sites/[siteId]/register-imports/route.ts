import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { applyRegisterImport } from '@/lib/services/register-import';

export const POST = apiRoute(ROUTES.applyRegisterImport, {
  site: ({ params }) => params.siteId,
  handle: ({ actor, params, body }) => applyRegisterImport(actor, params.siteId, body.csv, body.skipRejectedRows),
});

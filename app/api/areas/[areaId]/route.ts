import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { siteIdOfArea, updateArea } from '@/lib/services/areas';

export const PATCH = apiRoute(ROUTES.updateArea, {
  site: ({ params }) => siteIdOfArea(params.areaId),
  handle: ({ actor, params, body }) => updateArea(actor, params.areaId, body),
});

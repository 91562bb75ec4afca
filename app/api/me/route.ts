import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';

export const GET = apiRoute(ROUTES.me, {
  handle: async ({ actor }) => ({
    userId: actor.userId, name: actor.name, email: actor.email, role: actor.role,
    via: actor.via, readOnly: actor.readOnly, siteIds: actor.siteIds,
  }),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { updateUser } from '@/lib/services/users';

export const PATCH = apiRoute(ROUTES.updateUser, {
  handle: ({ actor, params, body }) => updateUser(actor, params.userId, body),
});

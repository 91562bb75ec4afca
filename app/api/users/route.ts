import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createUser, listUsers } from '@/lib/services/users';

export const GET = apiRoute(ROUTES.listUsers, {
  handle: async () => ({ items: await listUsers() }),
});

export const POST = apiRoute(ROUTES.createUser, {
  handle: ({ actor, body }) => createUser(actor, body),
});

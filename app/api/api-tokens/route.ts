import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createToken, listTokens } from '@/lib/services/api-tokens';

export const GET = apiRoute(ROUTES.listApiTokens, {
  handle: async () => ({ items: await listTokens() }),
});

export const POST = apiRoute(ROUTES.createApiToken, {
  handle: ({ actor, body }) => createToken(actor, body),
});

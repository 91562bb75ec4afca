import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { revokeToken } from '@/lib/services/api-tokens';

export const DELETE = apiRoute(ROUTES.revokeApiToken, {
  handle: ({ actor, params }) => revokeToken(actor, params.tokenId),
});

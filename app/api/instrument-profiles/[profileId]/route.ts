import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { getProfile, updateProfile } from '@/lib/services/instrument-profiles';

export const GET = apiRoute(ROUTES.getProfile, {
  handle: ({ params }) => getProfile(params.profileId),
});

export const PATCH = apiRoute(ROUTES.updateProfile, {
  handle: ({ actor, params, body }) => updateProfile(actor, params.profileId, body),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createProfile, listProfiles } from '@/lib/services/instrument-profiles';

export const GET = apiRoute(ROUTES.listProfiles, {
  handle: async () => ({ items: await listProfiles() }),
});

export const POST = apiRoute(ROUTES.createProfile, {
  handle: ({ actor, body }) => createProfile(actor, body),
});

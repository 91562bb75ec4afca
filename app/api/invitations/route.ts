import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { createInvitation, listInvitations } from '@/lib/services/invitations';

export const GET = apiRoute(ROUTES.listInvitations, { handle: () => listInvitations() });

export const POST = apiRoute(ROUTES.createInvitation, {
  handle: ({ actor, body }) => createInvitation(actor, body),
});

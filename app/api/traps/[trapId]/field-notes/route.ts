import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listTrapNotesAcrossSurveys } from '@/lib/services/field-notes';
import { siteIdOfTrap } from '@/lib/services/traps';

export const GET = apiRoute(ROUTES.listTrapNotesAcrossSurveys, {
  site: ({ params }) => siteIdOfTrap(params.trapId),
  handle: ({ actor, params }) => listTrapNotesAcrossSurveys(actor, params.trapId),
});

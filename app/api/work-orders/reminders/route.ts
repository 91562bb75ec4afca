import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { sendOverdueReminders } from '@/lib/services/work-orders';

// The same run as the server's interval, limited to the caller's sites.
export const POST = apiRoute(ROUTES.sendWorkOrderReminders, {
  handle: ({ actor }) => sendOverdueReminders(new Date(), actor.siteIds),
});

import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { listCaughtMail } from '@/lib/mail/mailbox';

export const GET = apiRoute(ROUTES.listMail, {
  handle: async ({ query }) => {
    const { items, total } = listCaughtMail({ to: query.to });
    return { items, total };
  },
});

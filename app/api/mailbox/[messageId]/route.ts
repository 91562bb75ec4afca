import { ROUTES } from '@/lib/api/routes';
import { apiRoute } from '@/lib/http/route';
import { notFound } from '@/lib/http/errors';
import { getCaughtMail } from '@/lib/mail/mailbox';

export const GET = apiRoute(ROUTES.getMail, {
  handle: async ({ params }) => {
    const message = getCaughtMail(params.messageId);
    if (!message) throw notFound('message');
    return message;
  },
});

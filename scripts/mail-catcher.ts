// Runs the development mail catcher on its own:
//   npx tsx scripts/mail-catcher.ts [port]      (default 2525; file: PLUMEWARD_MAILBOX or beside the database)
// then start the app with SMTP_URL=smtp://127.0.0.1:<port>. `npm run demo` starts one itself.
import { startMailCatcher } from '@/lib/mail/catcher';
import { mailboxPath } from '@/lib/mail/config';

const port = Number(process.argv[2] ?? process.env.MAIL_CATCHER_PORT ?? 2525);
startMailCatcher({ port, file: mailboxPath() })
  .then((c) => console.log(`Mail catcher on smtp://127.0.0.1:${c.port}, keeping messages in ${c.file}`))
  .catch((err) => {
    console.error(err);
    process.exit(1);
  });

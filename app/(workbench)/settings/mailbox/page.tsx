import Link from 'next/link';
import { requirePermission } from '@/lib/auth/page';
import { mailConfig } from '@/lib/mail/config';
import { getCaughtMail, listCaughtMail } from '@/lib/mail/mailbox';

export const metadata = { title: 'Development mailbox' };
export const dynamic = 'force-dynamic';

const when = (iso: string) => `${iso.replace('T', ' ').slice(0, 19)} UTC`;

export default async function MailboxPage({ searchParams }: { searchParams: Promise<{ id?: string }> }) {
  await requirePermission('mailbox.read');
  const { items, total, file } = listCaughtMail();
  const wanted = Number((await searchParams).id ?? items[0]?.id);
  const message = Number.isInteger(wanted) ? getCaughtMail(wanted) : null;
  const { smtpUrl } = mailConfig();
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        What the local SMTP catcher received ({total} message{total === 1 ? '' : 's'}). The demo and the tests send all mail to it; with a real
        SMTP server in <code>SMTP_URL</code> this page stays empty. Mail is sent to <code>{smtpUrl ?? 'nowhere (SMTP_URL not set)'}</code>; the catcher keeps it in <code className="break-all">{file}</code>.
      </p>
      <div className="grid gap-4 lg:grid-cols-5">
        <div className="panel overflow-x-auto lg:col-span-2">
          <table className="data-table" data-testid="mailbox">
            <thead><tr><th>To</th><th>Subject</th><th>When</th></tr></thead>
            <tbody>
              {items.map((m) => (
                <tr key={m.id} className={m.id === message?.id ? 'bg-accent-50' : ''}>
                  <td className="break-all text-xs">{m.to.join(', ')}</td>
                  <td><Link className="text-accent-700 hover:underline" href={`/settings/mailbox?id=${m.id}`}>{m.subject || '(no subject)'}</Link></td>
                  <td className="whitespace-nowrap text-xs text-ink-soft"><time dateTime={m.receivedAt}>{when(m.receivedAt)}</time></td>
                </tr>
              ))}
              {!items.length && <tr><td colSpan={3} className="text-ink-faint">Nothing received yet.</td></tr>}
            </tbody>
          </table>
        </div>
        <article className="panel space-y-3 p-4 lg:col-span-3" data-testid="mail-message">
          {message ? (
            <>
              <h2 className="font-semibold">{message.subject}</h2>
              <dl className="grid grid-cols-[5rem_1fr] gap-1 text-sm">
                <dt className="text-ink-soft">From</dt><dd>{message.from}</dd>
                <dt className="text-ink-soft">To</dt><dd>{message.to.join(', ')}</dd>
                <dt className="text-ink-soft">Received</dt><dd>{when(message.receivedAt)}</dd>
              </dl>
              <pre className="whitespace-pre-wrap rounded-md bg-surface-sunken p-3 font-sans text-sm">{message.text}</pre>
              {message.html && (
                <details>
                  <summary className="cursor-pointer text-sm text-accent-700">HTML version</summary>
                  {/* Sandboxed: no scripts, no same-origin access, whatever the message holds. */}
                  <iframe title="HTML version" sandbox="" srcDoc={message.html} className="mt-2 h-96 w-full rounded-md border border-line bg-white" />
                </details>
              )}
            </>
          ) : <p className="text-sm text-ink-faint">Pick a message.</p>}
        </article>
      </div>
    </div>
  );
}

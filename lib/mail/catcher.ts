// The development mail catcher: a real SMTP server on loopback that keeps every message it
// receives as one JSON line in a file, for the admin-only mailbox page. Started by the demo
// (scripts/demo.ts) and by the app tests' global setup; never part of the served app.
// Not for production: it accepts any sender and recipient without authentication.
import fs from 'node:fs';
import path from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { CaughtMessage } from './mailbox';

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  return (Array.isArray(value) ? value : [value]).flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);
}

function lastId(file: string): number {
  if (!fs.existsSync(file)) return 0;
  const lines = fs.readFileSync(file, 'utf8').split('\n').filter(Boolean);
  let max = 0;
  for (const line of lines) {
    try {
      max = Math.max(max, (JSON.parse(line) as { id: number }).id);
    } catch {
      // a torn last line from a crash: skipped
    }
  }
  return max;
}

export type MailCatcher = { port: number; file: string; close: () => Promise<void> };

export async function startMailCatcher(options: { file: string; port?: number; host?: string }): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  fs.mkdirSync(path.dirname(options.file), { recursive: true });
  let next = lastId(options.file);
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    banner: 'Plumeward development mail catcher',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const message: CaughtMessage = {
            id: ++next,
            receivedAt: new Date().toISOString(),
            envelope: {
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              to: session.envelope.rcptTo.map((r) => r.address),
            },
            from: addresses(mail.from)[0] ?? '',
            to: addresses(mail.to),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            messageId: mail.messageId ?? null,
          };
          fs.appendFileSync(options.file, JSON.stringify(message) + '\n');
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const port = await new Promise<number>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => {
      const address = server.server.address();
      resolve(typeof address === 'object' && address ? address.port : options.port ?? 0);
    });
  });
  return {
    port,
    file: options.file,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

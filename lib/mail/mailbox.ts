// Reading what the development catcher received (lib/mail/catcher.ts writes the file).
import fs from 'node:fs';
import { mailboxPath } from './config';

export type CaughtMessage = {
  id: number;
  receivedAt: string;
  envelope: { from: string; to: string[] };
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
};

export type MailboxEntry = Pick<CaughtMessage, 'id' | 'receivedAt' | 'from' | 'to' | 'subject'>;

function readAll(file = mailboxPath()): CaughtMessage[] {
  if (!fs.existsSync(file)) return [];
  const out: CaughtMessage[] = [];
  for (const line of fs.readFileSync(file, 'utf8').split('\n')) {
    if (!line.trim()) continue;
    try {
      out.push(JSON.parse(line) as CaughtMessage);
    } catch {
      // a line torn by a crash of the catcher: skipped
    }
  }
  return out;
}

/** Newest first; `to` filters by a recipient (case-insensitive). */
export function listCaughtMail(filter: { to?: string; limit?: number } = {}): { items: MailboxEntry[]; total: number; file: string } {
  const file = mailboxPath();
  let all = readAll(file).reverse();
  if (filter.to) {
    const to = filter.to.toLowerCase();
    all = all.filter((m) => [...m.to, ...m.envelope.to].some((a) => a.toLowerCase() === to));
  }
  return {
    items: all.slice(0, filter.limit ?? 200).map(({ id, receivedAt, from, to, subject }) => ({ id, receivedAt, from, to, subject })),
    total: all.length,
    file,
  };
}

export function getCaughtMail(id: number): CaughtMessage | null {
  return readAll().find((m) => m.id === id) ?? null;
}

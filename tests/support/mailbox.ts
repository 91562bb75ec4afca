// What the local SMTP catcher received, read through the admin's mailbox API.
import type { Client } from './http';

export type Mail = { id: number; to: string[]; subject: string; text: string; html: string | null; from: string };

export async function mailTo(admin: Client, to: string, subject: RegExp, timeoutMs = 10_000): Promise<Mail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const list = (await admin.get(`/api/mailbox?to=${encodeURIComponent(to)}`)).body.items as { id: number; subject: string }[];
    const hits = list.filter((m) => subject.test(m.subject));
    if (hits.length) return Promise.all(hits.map(async (m) => (await admin.get(`/api/mailbox/${m.id}`)).body as Mail));
    if (Date.now() > deadline) throw new Error(`No mail to ${to} matching ${subject} (got: ${list.map((m) => m.subject).join(' | ')})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

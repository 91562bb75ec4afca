import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { mailConfig } from './config';
import type { MailMessage } from './messages';

// One transport per server process, made from SMTP_URL the first time a message goes out.
const cache = globalThis as unknown as { plumewardMail?: { url: string; transport: Transporter } };

function transport(url: string): Transporter {
  if (cache.plumewardMail?.url !== url) {
    cache.plumewardMail = { url, transport: nodemailer.createTransport(url) };
  }
  return cache.plumewardMail.transport;
}

export type SendResult = { sent: true; messageId: string } | { sent: false; reason: string };

/**
 * Sends one message. Mail is a notice, not the record: the caller's change has already been saved,
 * so a mail server that is down is logged and reported, never thrown back at the user.
 */
export async function sendMail(message: MailMessage): Promise<SendResult> {
  const { smtpUrl, from } = mailConfig();
  if (!smtpUrl) {
    console.warn(`Mail not sent (SMTP_URL is not set): "${message.subject}" to ${message.to}`);
    return { sent: false, reason: 'SMTP_URL is not set' };
  }
  try {
    const info = await transport(smtpUrl).sendMail({ from, to: message.to, subject: message.subject, text: message.text, html: message.html });
    return { sent: true, messageId: info.messageId };
  } catch (err) {
    console.error(`Mail not sent: "${message.subject}" to ${message.to}`, err);
    return { sent: false, reason: (err as Error).message };
  }
}

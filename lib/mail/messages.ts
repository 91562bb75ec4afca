// The e-mails Plumeward sends, in our own words: plain text first, and a simple HTML version of
// the same content. Pure: values in, message out.

export type MailMessage = { to: string; subject: string; text: string; html: string };

import { SAFETY_POINTS, SAFETY_TITLE } from '@/lib/domain/safety';

// The one list of safety points (lib/domain/safety.ts), as e-mails carry it.
export const SAFETY_LINES = SAFETY_POINTS;
export { SAFETY_TITLE };

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type Block = { heading?: string; lines?: string[]; rows?: [string, string][]; link?: { label: string; href: string } };

function render(to: string, subject: string, greeting: string, blocks: Block[]): MailMessage {
  const text: string[] = [greeting, ''];
  const html: string[] = [`<p>${escape(greeting)}</p>`];
  for (const b of blocks) {
    if (b.heading) {
      text.push(b.heading.toUpperCase());
      html.push(`<h3 style="margin:16px 0 4px;font-size:14px">${escape(b.heading)}</h3>`);
    }
    if (b.rows) {
      const width = Math.max(...b.rows.map(([k]) => k.length));
      for (const [k, v] of b.rows) text.push(`${(k + ':').padEnd(width + 2)}${v}`);
      html.push(`<table style="border-collapse:collapse;font-size:14px">${b.rows.map(([k, v]) => `<tr><td style="padding:2px 12px 2px 0;color:#555">${escape(k)}</td><td style="padding:2px 0">${escape(v)}</td></tr>`).join('')}</table>`);
    }
    if (b.lines) {
      for (const l of b.lines) text.push(b.heading === SAFETY_TITLE ? `- ${l}` : l);
      html.push(b.heading === SAFETY_TITLE
        ? `<ul style="font-size:14px">${b.lines.map((l) => `<li>${escape(l)}</li>`).join('')}</ul>`
        : b.lines.map((l) => `<p style="font-size:14px">${escape(l)}</p>`).join(''));
    }
    if (b.link) {
      text.push(`${b.link.label}: ${b.link.href}`);
      html.push(`<p><a href="${escape(b.link.href)}">${escape(b.link.label)}</a></p>`);
    }
    text.push('');
  }
  text.push('— Plumeward');
  html.push('<p style="color:#777;font-size:12px">— Plumeward</p>');
  return { to, subject, text: text.join('\n'), html: `<div style="font-family:sans-serif;max-width:640px">${html.join('\n')}</div>` };
}

const safetyBlock: Block = { heading: SAFETY_TITLE, lines: [...SAFETY_LINES] };

export type WorkOrderMailInput = {
  to: string; assigneeName: string;
  workOrderId: number; url: string;
  siteName: string; tag: string; areaName: string | null; location: string | null;
  verdictLabel: string; actionLabel: string; priorityLabel: string; priorityReason: string | null;
  dueOn: string | null; surveyName: string;
};

function orderRows(w: WorkOrderMailInput): [string, string][] {
  return [
    ['Trap', w.tag],
    ['Site', w.siteName],
    ['Area', w.areaName ?? '—'],
    ['Location', w.location ?? '—'],
    ['Found', `${w.verdictLabel} (survey ${w.surveyName})`],
    ['Action', w.actionLabel],
    ['Priority', w.priorityReason ? `${w.priorityLabel} — ${w.priorityReason}` : w.priorityLabel],
    ['Due', w.dueOn ?? 'no date set'],
  ];
}

export function assignmentMail(w: WorkOrderMailInput): MailMessage {
  return render(w.to, `Work order #${w.workOrderId}: ${w.actionLabel.toLowerCase()} ${w.tag} at ${w.siteName}`, `Hello ${w.assigneeName},`, [
    { lines: [`You have been assigned work order #${w.workOrderId}. When the work is done, mark it done in Plumeward with the repair cost and notes; a later re-test of the trap verifies it.`] },
    { heading: 'The work', rows: orderRows(w) },
    { link: { label: 'Open the work order', href: w.url } },
    safetyBlock,
  ]);
}

export function reminderMail(w: WorkOrderMailInput & { daysOverdue: number }): MailMessage {
  const late = w.daysOverdue === 1 ? '1 day' : `${w.daysOverdue} days`;
  return render(w.to, `Overdue: work order #${w.workOrderId} (${w.tag}) was due ${w.dueOn}`, `Hello ${w.assigneeName},`, [
    { lines: [`Work order #${w.workOrderId} was due on ${w.dueOn} and is ${late} overdue. If the work is done, mark it done; if it cannot be done, tell the analyst who planned it so the date can be moved.`] },
    { heading: 'The work', rows: orderRows(w) },
    { link: { label: 'Open the work order', href: w.url } },
    safetyBlock,
  ]);
}

export type InvitationMailInput = {
  to: string; name: string; roleLabel: string; siteNames: string[]; invitedBy: string; url: string; expiresAt: Date;
};

export function invitationMail(i: InvitationMailInput): MailMessage {
  const expires = i.expiresAt.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
  return render(i.to, 'Your invitation to Plumeward', `Hello ${i.name},`, [
    { lines: [`${i.invitedBy} has invited you to Plumeward, the steam-trap survey workbench, as ${i.roleLabel.toLowerCase()}.`] },
    { rows: [['Role', i.roleLabel], ['Sites', i.siteNames.length ? i.siteNames.join(', ') : 'all sites (admin)'], ['Link valid until', expires]] },
    { lines: ['Open the link below to choose your password. The link works once; after that, or after it expires, ask for a new invitation.'] },
    { link: { label: 'Accept the invitation', href: i.url } },
    { lines: ['If you did not expect this message, ignore it: nothing happens until the link is used.'] },
  ]);
}

export type ReportMailInput = {
  to: string; name: string; siteName: string; surveyName: string; publishedOn: string; sentBy: string;
  surveyUrl: string; pdfUrl: string;
  figures: [string, string][];
};

/** A published survey for a plant's readers: its headline figures and links; the report itself stays behind sign-in. */
export function reportMail(r: ReportMailInput): MailMessage {
  return render(r.to, `Survey results: ${r.surveyName}, ${r.siteName}`, `Hello ${r.name},`, [
    { lines: [`${r.sentBy} has published the steam-trap survey ${r.surveyName} of ${r.siteName} (${r.publishedOn}).`] },
    { rows: r.figures },
    { lines: ['The links open after you sign in; the report is not attached, so it reaches only people who may read it.'] },
    { link: { label: 'Open the survey', href: r.surveyUrl } },
    { link: { label: 'Download the report (PDF)', href: r.pdfUrl } },
  ]);
}

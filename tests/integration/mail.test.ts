// E-mail over real SMTP: the app sends through nodemailer to the local catcher the global setup
// started on loopback; these tests read what it received through the admin's mailbox API.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { SAFETY_LINES } from '@/lib/mail/messages';
import { demoSites, signInAdmin, type SiteIds } from '../support/fixtures';
import { baseUrl, Client, DEMO, signedIn, unique } from '../support/http';
import { mailTo, type Mail } from '../support/mailbox';
import { queryDb } from '../support/own-server';
import { freshWorkOrder } from './samples/work-orders';


function expectSafetyText(mail: Mail) {
  for (const line of SAFETY_LINES) expect(mail.text).toContain(line);
  // The points the trade insists on, whatever the wording above.
  for (const word of [/isolate/i, /lockout/i, /depressurise/i, /let it cool/i, /protective equipment/i, /local codes and licensed practice/i]) expect(mail.text).toMatch(word);
}

/** Submits the invitation page's form as a browser without JavaScript would (the server action's id is in the form). */
async function acceptThroughPage(token: string, password: string) {
  const page = await fetch(`${baseUrl()}/invitations/${token}`);
  // React separates text runs with empty comments; they are no part of what a reader sees.
  const html = (await page.text()).replaceAll('<!-- -->', '');
  const actionField = /name="(\$ACTION_ID_[0-9a-f]+)"/.exec(html)?.[1];
  if (!actionField) return { status: page.status, html, location: null as string | null };
  const form = new FormData();
  form.append(actionField, '');
  form.append('token', token);
  form.append('password', password);
  form.append('confirm', password);
  const res = await fetch(`${baseUrl()}/invitations/${token}`, { method: 'POST', body: form, redirect: 'manual' });
  return { status: res.status, html, location: res.headers.get('location') };
}

async function setExpiry(invitationId: number, at: Date) {
  await queryDb(inject('dbPath'), 'UPDATE invitations SET expires_at = ? WHERE id = ?', [at.toISOString().replace('T', ' ').replace('Z', ' +00:00'), invitationId]);
}

describe('e-mail', () => {
  let admin: Client;
  let analyst: Client;
  let own: SiteIds;

  beforeAll(async () => {
    admin = await signInAdmin();
    ({ own } = await demoSites(admin));
    analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password);
  });

  it('tells the assignee of a new work order, with the trap, the priority and the safety points', async () => {
    const made = await freshWorkOrder(analyst, own.siteId, true);
    const order = (await analyst.get(`/api/work-orders/${made.id}`)).body;
    const [mail] = await mailTo(admin, DEMO.technician.email, new RegExp(`^Work order #${made.id}:`));
    expect(mail.to).toEqual([DEMO.technician.email]);
    expect(mail.from).toBe('no-reply@plumeward.example');
    expect(mail.subject).toBe(`Work order #${made.id}: repair ${order.tag} at Fenwick Vale Creamery`);
    expect(mail.text).toContain('Hello Demo Technician,');
    expect(mail.text).toContain(order.tag);
    expect(mail.text).toContain(order.priorityReason);
    expect(mail.text).toContain(`Due:      ${order.dueOn}`);
    expect(mail.text).toContain(`/sites/${own.siteId}/work-orders/${made.id}`);
    expectSafetyText(mail);
    expect(mail.html).toContain('<li>Isolate the trap upstream and downstream');
  });

  it('sends one reminder for an overdue order, not two on the same day', async () => {
    const made = await freshWorkOrder(analyst, own.siteId, true);
    const yesterdayButOne = new Date(Date.now() - 2 * 86_400_000).toISOString().slice(0, 10);
    const moved = await analyst.patch(`/api/work-orders/${made.id}`, { dueOn: yesterdayButOne });
    expect(moved.body).toMatchObject({ status: 'scheduled', overdue: true });
    const first = await analyst.post('/api/work-orders/reminders');
    expect(first.status).toBe(200);
    const [mail] = await mailTo(admin, DEMO.technician.email, new RegExp(`^Overdue: work order #${made.id} `));
    expect(mail.subject).toBe(`Overdue: work order #${made.id} (${moved.body.tag}) was due ${yesterdayButOne}`);
    expect(mail.text).toMatch(/is [23] days overdue/);
    expectSafetyText(mail);
    const second = await analyst.post('/api/work-orders/reminders');
    expect(second.body.workOrderIds).not.toContain(made.id);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailTo(admin, DEMO.technician.email, new RegExp(`^Overdue: work order #${made.id} `))).toHaveLength(1);
    expect((await analyst.get(`/api/work-orders/${made.id}`)).body.remindedAt).not.toBeNull();
  });

  describe('invitations', () => {
    async function invite(role = 'technician') {
      const email = `${unique('invitee')}@plumeward.example`.toLowerCase();
      const res = await admin.post('/api/invitations', { email, name: 'Ivy Invitee', role, siteIds: [own.siteId] });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body).toMatchObject({ email, state: 'pending', mailed: true });
      const [mail] = await mailTo(admin, email, /^Your invitation to Plumeward$/);
      const token = /\/invitations\/([A-Za-z0-9_-]{40,})/.exec(mail.text)?.[1];
      expect(token).toBeDefined();
      return { id: res.body.id as number, email, token: token!, mail, expiresAt: res.body.expiresAt as string };
    }

    it('is accepted once: the invitee chooses a password and signs in; the second use is refused', async () => {
      const inv = await invite();
      expect(inv.mail.text).toContain('Demo Admin has invited you');
      expect(inv.mail.text).toContain('Fenwick Vale Creamery');
      expect(Date.parse(inv.expiresAt) - Date.now()).toBeGreaterThan(71 * 3_600_000);
      expect((await admin.get('/api/invitations')).body.items.find((i: { id: number }) => i.id === inv.id)).toBeDefined();
      // Nothing in the list or the database gives the token back.
      expect(JSON.stringify((await admin.get('/api/invitations')).body)).not.toContain(inv.token);

      const first = await acceptThroughPage(inv.token, 'a-password-of-my-own');
      expect(first.html).toContain('Welcome, Ivy Invitee');
      expect(first.status).toBe(303);
      expect(first.location).toContain('/sign-in');
      const invitee = await signedIn(inv.email, 'a-password-of-my-own');
      expect((await invitee.get('/api/me')).body).toMatchObject({ role: 'technician' });
      expect((await invitee.get(`/api/sites/${own.siteId}/work-orders`)).status).toBe(200);

      const page = await fetch(`${baseUrl()}/invitations/${inv.token}`);
      expect(await page.text()).toContain('This invitation has already been used');
      expect((await admin.get('/api/invitations')).body.items.find((i: { id: number }) => i.id === inv.id).state).toBe('accepted');
    });

    it('is refused after it expires, and says so', async () => {
      const inv = await invite('viewer');
      await setExpiry(inv.id, new Date(Date.now() - 60_000));
      const res = await acceptThroughPage(inv.token, 'too-late-password');
      expect(res.html).toContain('This invitation has expired');
      expect(res.html).not.toContain('name="password"');
      const c = new Client();
      await c.signIn(inv.email, 'too-late-password');
      expect((await c.get('/api/auth/session')).body?.user).toBeUndefined();
    });

    it('refuses an address that already has an account, and an unknown link', async () => {
      const res = await admin.post('/api/invitations', { email: DEMO.viewer.email, name: 'Again', role: 'viewer', siteIds: [] });
      expect(res.status).toBe(409);
      const page = await fetch(`${baseUrl()}/invitations/not-a-real-token-at-all-0000000000`);
      expect(await page.text()).toContain('This link is not valid');
    });
  });
});

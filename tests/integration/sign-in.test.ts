// Sign-in over real HTTP, the session's contents, throttling, and account changes taking effect
// on the very next request (the session is checked against the database, not trusted).
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, DEMO } from '../support/http';

describe('sign-in', () => {
  let admin: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  beforeAll(async () => {
    admin = await signInAdmin();
    sites = await demoSites(admin);
  });

  it('csrf → credentials callback → session carrying id, role and sites', async () => {
    const client = new Client();
    const reply = await client.signIn(DEMO.viewer.email, DEMO.viewer.password);
    expect(reply.status).toBe(200);
    const session = await client.get('/api/auth/session');
    expect(session.body.user).toMatchObject({ email: DEMO.viewer.email, role: 'viewer', siteIds: [sites.own.siteId] });
    expect(Number(session.body.user.id)).toBeGreaterThan(0);
  });

  it('refuses a wrong password with no session', async () => {
    const client = new Client();
    const reply = await client.signIn(DEMO.analyst.email, 'not-the-password');
    expect(reply.status).toBe(401);
    expect((await client.get('/api/auth/session')).body).toEqual({});
    expect((await client.get('/api/me')).status).toBe(401);
  });

  it('throttles an e-mail after five failures, even with the right password', async () => {
    const user = await newUser(admin, 'viewer', [sites.own.siteId]);
    for (let i = 0; i < 5; i++) expect((await new Client().signIn(user.email, 'wrong-password')).status).toBe(401);
    const client = new Client();
    const reply = await client.signIn(user.email, user.password);
    expect(reply.status).toBe(401);
    expect(decodeURIComponent(String(reply.body.url))).toContain('Too many failed attempts');
    expect((await client.get('/api/me')).status).toBe(401);
  });

  it('locks a disabled user out on the next request, pages included', async () => {
    const user = await newUser(admin, 'analyst', [sites.own.siteId]);
    expect((await user.client.get('/api/me')).status).toBe(200);
    expect((await admin.patch(`/api/users/${user.id}`, { status: 'disabled' })).status).toBe(200);
    const me = await user.client.get('/api/me');
    expect(me.status).toBe(401);
    const page = await user.client.get(`/sites/${sites.own.siteId}/traps`);
    expect(page.status).toBe(307);
    expect(page.headers.get('location')).toContain('/sign-in');
    const again = new Client();
    const reply = await again.signIn(user.email, user.password);
    expect(decodeURIComponent(String(reply.body.url))).toContain('disabled');
  });

  it('applies a changed role and changed sites on the next request', async () => {
    const user = await newUser(admin, 'viewer', [sites.own.siteId]);
    const trap = { tag: 'ROLE-CHANGE-1', trapType: 'thermodynamic_disc', pressureBarg: 5 };
    expect((await user.client.post(`/api/sites/${sites.own.siteId}/traps`, trap)).status).toBe(403);
    await admin.patch(`/api/users/${user.id}`, { role: 'analyst', siteIds: [sites.other.siteId] });
    expect((await user.client.post(`/api/sites/${sites.other.siteId}/traps`, trap)).status).toBe(201);
    expect((await user.client.get(`/api/sites/${sites.own.siteId}`)).status).toBe(404);
  });

  it('signs out', async () => {
    const client = new Client();
    await client.signIn(DEMO.technician.email, DEMO.technician.password);
    expect((await client.get('/api/me')).status).toBe(200);
    const csrf = await client.get('/api/auth/csrf');
    await client.request('POST', '/api/auth/signout', new URLSearchParams({ csrfToken: csrf.body.csrfToken, json: 'true' }));
    expect((await client.get('/api/me')).status).toBe(401);
  });

  it('refuses a cross-site write made with the session cookie', async () => {
    const client = new Client();
    await client.signIn(DEMO.analyst.email, DEMO.analyst.password);
    const res = await client.request('POST', `/api/sites/${sites.own.siteId}/areas`, { name: 'Forged' }, { origin: 'http://evil.example' });
    expect(res.status).toBe(403);
  });
});

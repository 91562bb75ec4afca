// Sessions end: the session cookie is a JWT that next-auth issues for session.maxAge
// (SESSION_HOURS in lib/auth/options.ts). Once it has expired it is no session at all — 401 from
// the API, the sign-in page instead of a page, `unauthenticated` from a server action.
// (Disabled users and changed roles: sign-in.test.ts; site-scoped and read-only tokens: api-tokens.test.ts.)
import { encode } from 'next-auth/jwt';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSites, type SiteIds } from '../support/fixtures';
import { Client, DEMO, signedIn, unique } from '../support/http';
import { builtActions, callAction, pageUrl } from '../support/server-actions';

// Importing the options opens the app's Sequelize instance: point it at the test database first.
process.env.PLUMEWARD_DB ??= inject('dbPath');
const { authOptions } = await import('@/lib/auth/options');
const maxAge = authOptions.session!.maxAge!;

// The secret the shared test server runs with (tests/setup/app-server.ts). If it drifts, the
// control below fails, so the expiry test cannot pass for the wrong reason.
const SERVER_SECRET = 'test-secret-for-this-run-only';
// NEXTAUTH_URL is http://, so the cookie has no __Secure- prefix (next-auth core/lib/cookie.js).
const COOKIE = 'next-auth.session-token';

type Me = { userId: number; name: string; email: string };

/**
 * The cookie next-auth would have set at sign-in `ago` seconds ago: its `jwt` callback's token
 * (sub, name, email, uid), expiring `maxAge` after that sign-in.
 */
async function sessionCookie(me: Me, ago: number): Promise<string> {
  const token = { sub: String(me.userId), name: me.name, email: me.email, uid: me.userId, signedInAt: Math.floor(Date.now() / 1000) - ago };
  // encode() stamps exp = now + maxAge; a session signed in `ago` seconds ago has maxAge - ago left.
  return `${COOKIE}=${await encode({ token, secret: SERVER_SECRET, maxAge: maxAge - ago })}`;
}

describe('session expiry', () => {
  let sites: { own: SiteIds; other: SiteIds };
  let analyst: Me;

  beforeAll(async () => {
    const admin = await signedIn(DEMO.admin.email, DEMO.admin.password);
    sites = await demoSites(admin);
    analyst = (await (await signedIn(DEMO.analyst.email, DEMO.analyst.password)).get('/api/me')).body;
  });

  /** What the app answers to one cookie: an API route, a page, and a server action that writes. */
  async function probe(cookie: string) {
    const headers = { cookie };
    const api = await new Client().request('GET', '/api/me', undefined, headers);
    const page = await new Client().request('GET', `/sites/${sites.own.siteId}/traps`, undefined, headers);
    const createArea = builtActions().find((a) => a.filename === 'lib/actions/register.ts' && a.exportedName === 'createAreaAction')!;
    const action = await callAction(new Client(), createArea, [{ siteId: sites.own.siteId, area: { name: unique('Expiry') } }], {
      page: pageUrl(createArea.pages[0], sites.own),
      headers,
    });
    return { api, page, action: action.result };
  }

  it(`a sign-in's session lasts session.maxAge (${maxAge / 3600} hours)`, async () => {
    const client = new Client();
    const started = Date.now();
    const reply = await client.signIn(DEMO.analyst.email, DEMO.analyst.password);
    const line = reply.headers.getSetCookie().find((c) => c.startsWith(`${COOKIE}=`))!;
    const expires = Date.parse(/expires=([^;]+)/i.exec(line)![1]);
    expect(Math.abs(expires - (started + maxAge * 1000))).toBeLessThan(60_000);
    // A working day, not next-auth's default of 30 days.
    expect(maxAge).toBeLessThanOrEqual(24 * 3600);
  });

  it('a session with time left is signed in (the control: the crafted cookie is one the server accepts)', async () => {
    const { api, page, action } = await probe(await sessionCookie(analyst, maxAge - 60));
    expect(api.status).toBe(200);
    expect(api.body.userId).toBe(analyst.userId);
    expect(page.status).toBe(200);
    expect(action).toMatchObject({ ok: true, data: { siteId: sites.own.siteId } });
  });

  it('a session past its expiry is signed out everywhere', async () => {
    // A minute past the end: beyond the 15 s clock tolerance next-auth's decode allows (next-auth/jwt).
    const { api, page, action } = await probe(await sessionCookie(analyst, maxAge + 60));
    expect(api.status).toBe(401);
    expect(api.body.error.code).toBe('unauthenticated');
    expect(page.status).toBe(307);
    expect(new URL(page.headers.get('location')!, 'http://x').pathname).toBe('/sign-in');
    expect(action).toMatchObject({ ok: false, error: { code: 'unauthenticated' } });
  });

  it('a session renewed since its sign-in still ends a working day after the sign-in', async () => {
    // next-auth re-issues the cookie with a fresh expiry whenever the session is read; the sign-in time stays.
    const signedInAt = Math.floor(Date.now() / 1000) - maxAge - 60;
    const renewed = `${COOKIE}=${await encode({ token: { sub: String(analyst.userId), uid: analyst.userId, signedInAt }, secret: SERVER_SECRET, maxAge })}`;
    const { api, page, action } = await probe(renewed);
    expect(api.status).toBe(401);
    expect(page.status).toBe(307);
    expect(action).toMatchObject({ ok: false, error: { code: 'unauthenticated' } });
  });

  it('a cookie signed with another secret is no session either', async () => {
    const forged = `${COOKIE}=${await encode({ token: { sub: String(analyst.userId), uid: analyst.userId }, secret: 'not-the-server-secret', maxAge })}`;
    const { api, page, action } = await probe(forged);
    expect(api.status).toBe(401);
    expect(page.status).toBe(307);
    expect(action).toMatchObject({ ok: false, error: { code: 'unauthenticated' } });
  });
});

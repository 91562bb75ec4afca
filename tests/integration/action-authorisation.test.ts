// Every server action × every role × own site / other site / no session, called over HTTP as the
// browser calls it, with the exact outcome. Generated from ACTION_REGISTRY (defineAction) and the
// build's server reference manifest: an action without a sample, or one that is not made with
// defineAction, fails. Plus: account changes apply on the next call, and a cross-site post to
// any action is refused before it runs.
import fs from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { roleMay, type Permission } from '@/lib/auth/permissions';
import { ROLES, type Role } from '@/lib/domain/vocabulary';
import { ERROR_STATUS, type ErrorCode } from '@/lib/http/errors';
import { queryDb } from '../support/own-server';
import { demoSites, newUser, signInAdmin, type SiteIds } from '../support/fixtures';
import { baseUrl, Client } from '../support/http';
import { builtActions, callAction, FlightError, pageUrl, type BuiltAction } from '../support/server-actions';
import { ACTION_SAMPLES } from './samples/actions';
import type { SampleContext } from './samples/sample';

const root = path.resolve(__dirname, '../..');

// The action modules open the app's one Sequelize instance when imported: point it at the test
// database (no query is made from here), then import them so ACTION_REGISTRY fills.
process.env.PLUMEWARD_DB ??= inject('dbPath');
const { ACTION_REGISTRY } = await import('@/lib/actions/define-action');
const built = builtActions();
const sources = [
  ...fs.readdirSync(path.join(root, 'lib/actions')).filter((f) => f.endsWith('.ts') && f !== 'define-action.ts').map((f) => `lib/actions/${f}`),
  ...built.map((a) => a.filename),
];
const modules = new Map<string, Record<string, unknown>>();
for (const file of new Set(sources)) modules.set(file, await import(path.join(root, file)));

/** Server actions that are not made with defineAction, each with the reason and where it is tested. */
const OUTSIDE_DEFINE_ACTION: Record<string, string> = {
  'app/(auth)/invitations/[token]/actions.ts#acceptInvitationAction':
    'the invitee has no session yet; the single-use token is the credential (tests/integration/mail.test.ts)',
};

type Registered = { name: string; permission: Permission; hasSite: boolean; built: BuiltAction | undefined };
const registered: Registered[] = [...ACTION_REGISTRY].map(([name, spec]) => ({
  name,
  permission: spec.permission,
  hasSite: spec.hasSite,
  built: built.find((b) => modules.get(b.filename)?.[b.exportedName] === spec.action),
}));
const callable = registered.filter((r): r is Registered & { built: BuiltAction } => !!r.built);

/** Membership as the fixtures make it: the admin sees every site, the others belong to the own site only. */
const memberOf = (role: Role, where: 'own' | 'other') => role === 'admin' || where === 'own';

/** The outcome the wrapper must give, from the permission matrix and the membership. */
function expected(role: Role, action: Registered, where: 'own' | 'other'): 'ok' | ErrorCode {
  if (!roleMay(role, action.permission)) return 'forbidden';
  if (action.hasSite && !memberOf(role, where)) return 'not_found';
  return 'ok';
}

/** Audit events written by one user after a given event id: every write an action makes leaves one. */
function auditSince(afterId: number, userId: number): Promise<{ id: number; action: string }[]> {
  return queryDb(inject('dbPath'), 'SELECT id, action FROM audit_events WHERE id > ? AND (? = 0 OR user_id = ?) ORDER BY id', [afterId, userId, userId]);
}
const lastAuditId = async () => (await auditSince(0, 0)).at(-1)?.id ?? 0;

describe('server action authorisation, action by action', () => {
  let ctx: SampleContext;
  let sites: { own: SiteIds; other: SiteIds };
  const clients = {} as Record<Role, Client>;
  const userIds = {} as Record<Role, number>;

  beforeAll(async () => {
    const admin = await signInAdmin();
    sites = await demoSites(admin);
    clients.admin = admin;
    for (const role of ROLES.filter((r) => r !== 'admin')) clients[role] = (await newUser(admin, role, [sites.own.siteId])).client;
    for (const role of ROLES) userIds[role] = (await clients[role].get('/api/me')).body.userId;
    ctx = { admin, analystId: userIds.analyst };
  });

  it('has a sample for every registered action, and every registered action is in the build', () => {
    const names = registered.map((r) => r.name).sort();
    expect(Object.keys(ACTION_SAMPLES).sort()).toEqual(names);
    // An action no page imports is not in the build: it cannot be called, so it should not exist.
    expect(callable.map((r) => r.name).sort(), 'registered but not built').toEqual(names);
  });

  it('finds every action of the build in ACTION_REGISTRY, or in the short list of exceptions', () => {
    for (const action of built) {
      const key = `${action.filename}#${action.exportedName}`;
      const made = registered.some((r) => r.built === action);
      expect(made || key in OUTSIDE_DEFINE_ACTION, `${key} is not made with defineAction`).toBe(true);
      expect(action.pages.length, `${key} is on no page`).toBeGreaterThan(0);
    }
  });

  /** Calls the action from its first page on the own site (where the user's browser would be). */
  async function call(client: Client, action: Registered & { built: BuiltAction }, arg: unknown, origin?: string) {
    const page = pageUrl(action.built.pages[0], sites.own);
    return callAction(client, action.built, [arg], { page, origin });
  }

  async function expectOutcome(role: Role | null, action: Registered & { built: BuiltAction }, ids: SiteIds, want: 'ok' | ErrorCode, arg?: unknown) {
    const input = arg ?? (await ACTION_SAMPLES[action.name](ids, ctx));
    const before = await lastAuditId();
    const reply = await call(role ? clients[role] : new Client(), action, input);
    // The wrapper returns its refusals as results: the HTTP exchange itself succeeds.
    expect(reply.status).toBe(200);
    const result = reply.result;
    if (result instanceof FlightError) throw result;
    const written = role ? await auditSince(before, userIds[role]) : await auditSince(before, 0);
    if (want === 'ok') {
      expect(result, JSON.stringify(result)).toMatchObject({ ok: true, data: expect.any(Object) });
      expect(written.length, 'a write leaves an audit event').toBeGreaterThan(0);
    } else {
      expect(result, JSON.stringify(result)).toMatchObject({ ok: false, error: { code: want, message: expect.any(String) } });
      expect(written, 'a refused action writes nothing').toEqual([]);
    }
  }

  it.each(callable.map((a) => [a.name, a] as const))('%s: unauthenticated (401) without a session', async (_name, action) => {
    expect(ERROR_STATUS.unauthenticated).toBe(401);
    await expectOutcome(null, action, sites.own, 'unauthenticated');
  });

  for (const role of ROLES) {
    it.each(callable.map((a) => [a.name, a] as const))(`%s as ${role}: own site`, async (_name, action) => {
      await expectOutcome(role, action, sites.own, expected(role, action, 'own'));
    });
    it.each(callable.filter((a) => a.hasSite).map((a) => [a.name, a] as const))(`%s as ${role}: another site's record`, async (_name, action) => {
      await expectOutcome(role, action, sites.other, expected(role, action, 'other'));
    });
  }

  it.each(callable.filter((a) => a.hasSite).map((a) => [a.name, a] as const))('%s as admin: a record that does not exist is not_found', async (_name, action) => {
    const sample = await ACTION_SAMPLES[action.name](sites.own, ctx);
    // Every id naming the record (the top-level …Id fields) points nowhere.
    const missing = Object.fromEntries(Object.entries(sample).map(([k, v]) => [k, /Id$/.test(k) ? 999_999 : v]));
    await expectOutcome('admin', action, sites.own, 'not_found', missing);
  });

  // The wrapper re-reads the user on every call (lib/auth/actor.ts), as routes do (sign-in.test.ts).
  describe('account changes take effect on the next action call', () => {
    const createArea = () => callable.find((a) => a.name === 'createArea')!;

    it('a disabled user is unauthenticated', async () => {
      const user = await newUser(clients.admin, 'analyst', [sites.own.siteId]);
      expect((await call(user.client, createArea(), await ACTION_SAMPLES.createArea(sites.own, ctx))).result).toMatchObject({ ok: true });
      expect((await clients.admin.patch(`/api/users/${user.id}`, { status: 'disabled' })).status).toBe(200);
      const reply = await call(user.client, createArea(), await ACTION_SAMPLES.createArea(sites.own, ctx));
      expect(reply.result).toMatchObject({ ok: false, error: { code: 'unauthenticated' } });
    });

    it('a changed role and changed sites apply at once', async () => {
      const user = await newUser(clients.admin, 'viewer', [sites.own.siteId]);
      const attempt = async (ids: SiteIds) => (await call(user.client, createArea(), await ACTION_SAMPLES.createArea(ids, ctx))).result;
      expect(await attempt(sites.own)).toMatchObject({ ok: false, error: { code: 'forbidden' } });
      expect((await clients.admin.patch(`/api/users/${user.id}`, { role: 'analyst', siteIds: [sites.other.siteId] })).status).toBe(200);
      expect(await attempt(sites.other)).toMatchObject({ ok: true });
      expect(await attempt(sites.own)).toMatchObject({ ok: false, error: { code: 'not_found' } });
    });
  });

  describe('cross-site posts', () => {
    // What a browser sends as Origin from another site, from a sandboxed frame, and from our host
    // on another port (another origin all the same).
    const foreign = () => ['http://evil.example', 'null', `http://${new URL(baseUrl()).hostname}:1`];

    // Next compares the Origin header with Host for every server action (action-handler.js,
    // handleAction) and, on a mismatch, answers 500 without running it: a fetch action gets the
    // refusal as an error row in place of its result, a form posted without JavaScript a plain 500.
    it.each(built.map((b) => [`${b.filename}#${b.exportedName}`, b] as const))('%s: refused from a foreign origin', async (_key, action) => {
      const admin = clients.admin;
      const page = pageUrl(action.pages[0], { ...sites.own, token: 'not-a-token' });
      const registeredAs = registered.find((r) => r.built === action);
      const arg = registeredAs ? await ACTION_SAMPLES[registeredAs.name](sites.own, ctx) : {};
      const before = await lastAuditId();

      for (const origin of foreign()) {
        const fetched = await callAction(admin, action, [arg], { page, origin });
        expect(fetched.status, origin).toBe(500);
        expect(fetched.result, origin).toBeInstanceOf(FlightError);
      }

      const form = new FormData();
      form.set(`$ACTION_ID_${action.id}`, '');
      for (const [k, v] of Object.entries(arg)) form.set(k, String(v));
      const posted = await admin.request('POST', page, form, { origin: foreign()[0] });
      expect(posted.status).toBe(500);
      expect(posted.headers.get('content-type')).toBe('text/plain');
      expect(posted.body).toBe('Internal Server Error');

      expect(await auditSince(before, 0), 'nothing ran').toEqual([]);
    });

    it('the same call from the app\'s own origin runs (the control)', async () => {
      const action = callable.find((a) => a.name === 'createArea')!;
      const reply = await call(clients.admin, action, await ACTION_SAMPLES.createArea(sites.own, ctx));
      expect(reply.result).toMatchObject({ ok: true });
    });
  });
});

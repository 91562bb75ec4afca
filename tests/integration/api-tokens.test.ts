// Personal API tokens as scripts use them: Authorization: Bearer …
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { hashToken } from '@/lib/auth/tokens';
import { demoSites, signInAdmin } from '../support/fixtures';
import { Client, DEMO_ANALYST_TOKEN, unique } from '../support/http';
import { queryDb as query } from '../support/own-server';

const queryDb = <T>(sql: string, params: unknown[] = []) => query<T>(inject('dbPath'), sql, params);

describe('API tokens', () => {
  let admin: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  let analystId: number;
  beforeAll(async () => {
    admin = await signInAdmin();
    sites = await demoSites(admin);
    analystId = (await new Client(DEMO_ANALYST_TOKEN).get('/api/me')).body.userId;
  });

  const makeToken = async (extra: Record<string, unknown> = {}) => {
    const res = await admin.post('/api/api-tokens', { name: unique('script'), userId: analystId, ...extra });
    expect(res.status).toBe(201);
    return res.body as { id: number; secret: string; prefix: string };
  };

  it('works as a bearer token and is stored only as its hash', async () => {
    const token = await makeToken();
    const me = await new Client(token.secret).get('/api/me');
    expect(me.body).toMatchObject({ userId: analystId, via: 'token', readOnly: false });
    const rows = await queryDb<{ token_hash: string; prefix: string }>('SELECT token_hash, prefix FROM api_tokens WHERE id = ?', [token.id]);
    expect(rows[0].token_hash).toBe(hashToken(token.secret));
    expect(rows[0].token_hash).not.toContain(token.secret.slice(4));
    expect(token.secret.startsWith(rows[0].prefix)).toBe(true);
    const listed = (await admin.get('/api/api-tokens')).body.items.find((t: { id: number }) => t.id === token.id);
    expect(listed).not.toHaveProperty('secret');
  });

  it('is refused once revoked', async () => {
    const token = await makeToken();
    const client = new Client(token.secret);
    expect((await client.get(`/api/sites/${sites.own.siteId}/traps`)).status).toBe(200);
    expect((await admin.delete(`/api/api-tokens/${token.id}`)).status).toBe(200);
    const res = await client.get(`/api/sites/${sites.own.siteId}/traps`);
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/revoked/);
  });

  it('limited to one site, treats the other site as absent', async () => {
    const token = await makeToken({ siteIds: [sites.other.siteId] });
    const client = new Client(token.secret);
    expect((await client.get(`/api/traps/${sites.other.trapId}`)).status).toBe(200);
    expect((await client.get(`/api/traps/${sites.own.trapId}`)).status).toBe(404);
    expect((await client.get('/api/me')).body.siteIds).toEqual([sites.other.siteId]);
  });

  it('read-only refuses every write with 403 and still reads', async () => {
    const token = await makeToken({ readOnly: true });
    const client = new Client(token.secret);
    expect((await client.get(`/api/sites/${sites.own.siteId}/areas`)).status).toBe(200);
    const res = await client.post(`/api/sites/${sites.own.siteId}/areas`, { name: unique('Nope') });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/read-only/);
  });

  it('refuses a malformed or unknown bearer header instead of falling back to the cookie', async () => {
    expect((await new Client('pwt_not-a-real-token').get('/api/me')).status).toBe(401);
    const res = await fetch(`${inject('baseUrl')}/api/me`, { headers: { authorization: 'Basic abc' } });
    expect(res.status).toBe(401);
  });

  it('cannot be limited to a site its owner does not belong to', async () => {
    const technician = (await admin.get('/api/users')).body.items.find((u: { email: string }) => u.email === 'technician@plumeward.example');
    const res = await admin.post('/api/api-tokens', { name: unique('x'), userId: technician.id, siteIds: [sites.other.siteId] });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('siteIds');
  });
});

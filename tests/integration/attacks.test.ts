// Attacks over HTTP against the built app, each with the exact refusal or the exact harmless
// outcome: the security headers on pages and on API responses, cross-site writes made with the
// session cookie, formula-looking names flowing into the CSV and spreadsheet exports, and an upload
// past the proxy's body limit (the upload routes must stay outside proxy.ts's matcher), and the NUL
// character in text (JSON bodies, query strings, server actions).
// Covered elsewhere, not repeated here: zip bombs, traversal names, truncated zips, a PNG renamed
// .csv, empty and header-only files, 413 for oversized uploads (tests/integration/uploads.test.ts,
// tests/lib/import/zip-read.test.ts); brute-force sign-in (tests/integration/sign-in.test.ts);
// the neutralise rule itself (tests/lib/reports/neutralise.test.ts).
import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import { beforeAll, describe, expect, it } from 'vitest';
import { signInAdmin } from '../support/fixtures';
import { baseUrl, Client, unique } from '../support/http';
import { builtActions, callAction, pageUrl } from '../support/server-actions';
import { settled, upload } from '../support/uploads';
import { csvRecords, readWorkbook, sheetRecords } from '../lib/reports/read-report';

const MB = 1024 * 1024;
const REFUSED = { error: { code: 'forbidden', message: 'Cross-site request refused.' } };

// The policies as DEVELOPERS.md ("Security headers") states them, written out here on their own.
const pagePolicy = (nonce: string) =>
  `default-src 'self'; script-src 'self' 'nonce-${nonce}' 'strict-dynamic'; style-src 'self' 'nonce-${nonce}'; style-src-attr 'unsafe-inline'; ` +
  "img-src 'self'; font-src 'self'; connect-src 'self'; worker-src 'self'; object-src 'none'; frame-src 'none'; base-uri 'none'; " +
  "form-action 'self'; frame-ancestors 'none'";
const API_POLICY = "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'; sandbox";

function expectCommonHeaders(headers: Headers) {
  expect(headers.get('x-content-type-options')).toBe('nosniff');
  expect(headers.get('referrer-policy')).toBe('same-origin');
  expect(headers.get('x-frame-options')).toBe('DENY');
}

/** A page's nonce, after checking its policy is exactly the page policy around it. */
function nonceOf(headers: Headers): string {
  const csp = headers.get('content-security-policy') ?? '';
  const nonce = /'nonce-([A-Za-z0-9+/]+={0,2})'/.exec(csp)?.[1];
  expect(nonce, csp).toBeDefined();
  expect(csp).toBe(pagePolicy(nonce!));
  return nonce!;
}

/** Every script and stylesheet tag of the HTML, which must all carry the page's nonce. */
function tagsWithout(html: string, nonce: string): string[] {
  const tags = html.match(/<script\b[^>]*>|<link\b[^>]*rel="stylesheet"[^>]*>|<style\b[^>]*>/g) ?? [];
  expect(tags.length).toBeGreaterThan(0);
  return tags.filter((t) => !t.includes(`nonce="${nonce}"`));
}

async function fetchBytes(secret: string, path: string) {
  const res = await fetch(baseUrl() + path, { headers: { authorization: `Bearer ${secret}` } });
  expect(res.status, path).toBe(200);
  return new Uint8Array(await res.arrayBuffer());
}

describe('attacks and their exact refusals', () => {
  let admin: Client;
  let adminToken: string;
  let siteId: number;
  let surveyId: number;
  const siteName = '=HYPERLINK("http://example.invalid/x","open me")';
  const surveyName = '@SUM(1) spring round';
  // As sent → as stored (names are trimmed, so a leading tab or CR goes) → as exported.
  const areaNames = [
    ['+1+1', '+1+1', "'+1+1"],
    ['-2', '-2', "'-2"],
    ['@SUM(1)', '@SUM(1)', "'@SUM(1)"],
    ['\t=1+2', '=1+2', "'=1+2"],
    ['\r-3+4', '-3+4', "'-3+4"],
    ['Boiler House', 'Boiler House', 'Boiler House'],
  ] as const;

  beforeAll(async () => {
    admin = await signInAdmin();
    const me = (await admin.get('/api/me')).body;
    const token = await admin.post('/api/api-tokens', { name: unique('attacks'), userId: me.userId });
    expect(token.status, JSON.stringify(token.body)).toBe(201);
    adminToken = token.body.secret;
    const site = await admin.post('/api/sites', {
      name: siteName, code: `AT${Date.now().toString(36).slice(-6).toUpperCase()}`, timeZone: 'Europe/Madrid', currency: 'EUR', unitSystem: 'si',
    });
    expect(site.status, JSON.stringify(site.body)).toBe(201);
    siteId = site.body.id;
    const survey = await admin.post(`/api/sites/${siteId}/surveys`, { name: surveyName, startsOn: '2026-03-01', endsOn: '2026-04-30', status: 'in_progress' });
    expect(survey.status, JSON.stringify(survey.body)).toBe(201);
    surveyId = survey.body.id;
  });

  describe('security headers', () => {
    it('a page: nosniff, same-origin referrer, DENY framing, and the page policy with a fresh nonce on every script and stylesheet', async () => {
      const nonces = new Set<string>();
      for (const path of ['/sign-in', '/sign-in', '/no-such-page']) {
        const res = await fetch(baseUrl() + path);
        expect(res.status).toBe(path === '/no-such-page' ? 404 : 200);
        expectCommonHeaders(res.headers);
        const nonce = nonceOf(res.headers);
        expect(Buffer.from(nonce, 'base64').length).toBeGreaterThanOrEqual(16);
        expect(tagsWithout(await res.text(), nonce)).toEqual([]);
        nonces.add(nonce);
      }
      expect(nonces.size).toBe(3);
    });

    it('a signed-in page carries the same headers', async () => {
      const res = await admin.get(`/sites/${siteId}`);
      expect(res.status).toBe(200);
      expectCommonHeaders(res.headers);
      expect(tagsWithout(res.body as string, nonceOf(res.headers))).toEqual([]);
    });

    it.each([
      ['a refused call', '/api/me', 401],
      ['the prerendered OpenAPI document', '/api/openapi.json', 200],
    ])('an API response (%s): the same headers and a policy under which nothing runs', async (_what, path, status) => {
      const res = await fetch(baseUrl() + path);
      expect(res.status).toBe(status);
      expectCommonHeaders(res.headers);
      expect(res.headers.get('content-security-policy')).toBe(API_POLICY);
    });
  });

  describe('cross-site writes with the session cookie', () => {
    const ownOrigin = () => new URL(baseUrl()).origin;

    it.each([
      ['a foreign Origin', { origin: 'http://evil.example' }],
      ['our host on another port as Origin', { origin: 'http://127.0.0.1:1' }],
      ['Origin "null" (a sandboxed frame)', { origin: 'null' }],
      ['no Origin, Sec-Fetch-Site cross-site', { 'sec-fetch-site': 'cross-site' }],
      ['no Origin, Sec-Fetch-Site same-site', { 'sec-fetch-site': 'same-site' }],
      ['our own Origin but Sec-Fetch-Site cross-site', { origin: 'OWN', 'sec-fetch-site': 'cross-site' }],
    ])('POST with %s: 403, and nothing written', async (_what, headers) => {
      const h = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k, v === 'OWN' ? ownOrigin() : v]));
      const name = unique('Forged area');
      const res = await admin.request('POST', `/api/sites/${siteId}/areas`, { name }, h);
      expect(res.status).toBe(403);
      expect(res.body).toEqual(REFUSED);
      const areas = (await admin.get(`/api/sites/${siteId}/areas`)).body.items as { name: string }[];
      expect(areas.map((a) => a.name)).not.toContain(name);
    });

    it('PATCH and DELETE with a foreign Origin: 403, record and token unchanged', async () => {
      const area = await admin.post(`/api/sites/${siteId}/areas`, { name: unique('Kept area') });
      expect(area.status).toBe(201);
      const patched = await admin.request('PATCH', `/api/areas/${area.body.id}`, { name: 'Renamed by a forged form' }, { origin: 'http://evil.example' });
      expect(patched.status).toBe(403);
      expect(patched.body).toEqual(REFUSED);
      const areas = (await admin.get(`/api/sites/${siteId}/areas`)).body.items as { id: number; name: string }[];
      expect(areas.find((a) => a.id === area.body.id)!.name).toBe(area.body.name);

      const me = (await admin.get('/api/me')).body;
      const victim = await admin.post('/api/api-tokens', { name: unique('victim'), userId: me.userId });
      const revoked = await admin.request('DELETE', `/api/api-tokens/${victim.body.id}`, undefined, { 'sec-fetch-site': 'cross-site' });
      expect(revoked.status).toBe(403);
      expect(revoked.body).toEqual(REFUSED);
      expect((await new Client(victim.body.secret).get('/api/me')).status).toBe(200);
    });

    it('the same writes from our own pages, and reads from anywhere, go through', async () => {
      const fromPage = await admin.request('POST', `/api/sites/${siteId}/areas`, { name: unique('Own page area') }, { origin: ownOrigin(), 'sec-fetch-site': 'same-origin' });
      expect(fromPage.status, JSON.stringify(fromPage.body)).toBe(201);
      const noHeaders = await admin.post(`/api/sites/${siteId}/areas`, { name: unique('Plain client area') });
      expect(noHeaders.status).toBe(201);
      const read = await admin.request('GET', `/api/sites/${siteId}/areas`, undefined, { origin: 'http://evil.example', 'sec-fetch-site': 'cross-site' });
      expect(read.status).toBe(200);
    });

    it('a script with a bearer token sends no Origin and is not refused', async () => {
      const script = new Client(adminToken);
      const res = await script.post(`/api/sites/${siteId}/areas`, { name: unique('Script area') });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    });
  });

  describe('formula injection into the exports', () => {
    it.each([
      '=HYPERLINK("http://example.invalid","x")', '+1+1', '-2', '@SUM(1)', '\t=1+2', '\r=1+2',
    ])('a trap tag %j is refused with 422 and the field', async (tag) => {
      const res = await admin.post(`/api/sites/${siteId}/traps`, { tag, trapType: 'thermodynamic_disc', pressureBarg: 8 });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('invalid');
      expect(res.body.error.details).toEqual([{ path: 'tag', message: 'A tag is letters, digits and . _ / - (starting with a letter or digit).' }]);
    });

    it('site, survey and area names that read as formulas come out as text in the CSV and the spreadsheet', async () => {
      for (const [i, [sent, stored]] of areaNames.entries()) {
        const area = await admin.post(`/api/sites/${siteId}/areas`, { name: sent });
        expect(area.status, JSON.stringify(area.body)).toBe(201);
        expect(area.body.name).toBe(stored);
        const trap = await admin.post(`/api/sites/${siteId}/traps`, { tag: `AT-${i + 1}`, areaId: area.body.id, trapType: 'thermodynamic_disc', pressureBarg: 8 });
        expect(trap.status, JSON.stringify(trap.body)).toBe(201);
      }
      const exported = areaNames.map(([, , out]) => out).sort();

      const csv = csvRecords(await fetchBytes(adminToken, `/api/surveys/${surveyId}/report?format=csv&table=areas`)).data;
      expect(csv.map((r) => r['Area']).sort()).toEqual(exported);
      expect(new Set(csv.map((r) => r['Survey']))).toEqual(new Set([`'${surveyName}`]));

      const wb = await readWorkbook(await fetchBytes(adminToken, `/api/surveys/${surveyId}/report?format=xlsx`));
      const byArea = sheetRecords(wb.getWorksheet('By area')!);
      expect(byArea.map((r) => r['Area'].value).sort()).toEqual(exported);
      for (const r of byArea) expect(r['Area'].type).toBe(ExcelJS.ValueType.String);
      const summary = Object.fromEntries(sheetRecords(wb.getWorksheet('Summary')!).map((r) => [r['Figure'].value, r['Value'].value]));
      expect(summary['Site']).toBe(`'${siteName} (${(await admin.get(`/api/sites/${siteId}`)).body.code})`);
      expect(summary['Survey']).toBe(`'${surveyName}`);
      // The title row starts with our own words, so it needs no apostrophe; it is text all the same.
      expect(wb.getWorksheet('Summary')!.getCell('A1').value).toBe(`Survey report — ${surveyName}, ${siteName}`);
      wb.eachSheet((ws) => ws.eachRow((row) => row.eachCell((c) => expect(c.type, `${ws.name}!${c.address}`).not.toBe(ExcelJS.ValueType.Formula))));
    });
  });

  describe('the NUL character in text', () => {
    // Refused wherever it arrives (lib/validation/no-nul.ts): PostgreSQL cannot store it, SQLite would.
    const NUL = { code: 'invalid', message: 'Text may not contain the NUL character.' };
    const detail = (path: string) => [{ path, message: 'Text may not contain the NUL character (\\u0000).' }];

    it('in a JSON body: 422 naming the field, nothing stored', async () => {
      const tag = unique('NUL');
      const res = await admin.post(`/api/sites/${siteId}/traps`, { tag, location: 'Header 2\u0000, east', trapType: 'float', pressureBarg: 5 });
      expect(res.status).toBe(422);
      expect(res.body).toEqual({ error: { ...NUL, details: detail('location') } });
      expect((await admin.get(`/api/sites/${siteId}/traps?q=${tag}`)).body.total).toBe(0);
    });

    it('in a query string: 422 naming the parameter', async () => {
      const res = await admin.get(`/api/sites/${siteId}/traps?q=LD%00`);
      expect(res.status).toBe(422);
      expect(res.body).toEqual({ error: { ...NUL, details: detail('q') } });
    });

    it('in a server action: refused with the field, nothing stored', async () => {
      const createArea = builtActions().find((a) => a.filename === 'lib/actions/register.ts' && a.exportedName === 'createAreaAction')!;
      const name = `${unique('Nul area')}\u0000`;
      const called = await callAction(admin, createArea, [{ siteId, area: { name } }], { page: pageUrl(createArea.pages[0], { siteId }) });
      expect(called.result).toEqual({ ok: false, error: { ...NUL, details: detail('area.name') } });
      const areas = (await admin.get(`/api/sites/${siteId}/areas`)).body.items as { name: string }[];
      expect(areas.some((a) => a.name.startsWith(name.slice(0, -1)))).toBe(false);
    });
  });

  it('an upload past the 10 MB a proxy would cut arrives whole (the upload routes are outside its matcher)', async () => {
    const files = [
      { name: 'padding-a.bin', bytes: new Uint8Array(6 * MB).fill(1) },
      { name: 'padding-b.bin', bytes: new Uint8Array(5 * MB).fill(2) },
      { name: 'last.bin', bytes: new Uint8Array(1000).fill(3) },
    ];
    const sent = await upload(admin, surveyId, files);
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const done = await settled(admin, sent.body.id, 60_000);
    const received = (done.files as { name: string; size: number; sha256: string }[]).map((f) => [f.name, f.size, f.sha256]).sort();
    expect(received).toEqual(files.map((f) => [f.name, f.bytes.length, createHash('sha256').update(f.bytes).digest('hex')]).sort());
  });
});

// The trap register over HTTP: paging, sorting and filtering on the server; shared validation;
// and the register CSV import with its preview that writes nothing.
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';

describe('trap register', () => {
  let analyst: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  beforeAll(async () => {
    const admin = await signInAdmin();
    sites = await demoSites(admin);
    analyst = (await newUser(admin, 'analyst', [sites.own.siteId, sites.other.siteId])).client;
  });
  const traps = (query = '') => analyst.get(`/api/sites/${sites.own.siteId}/traps${query}`);

  it('pages through the whole register without overlap', async () => {
    const first = await traps('?pageSize=25&page=1');
    const second = await traps('?pageSize=25&page=2');
    expect(first.body.total).toBeGreaterThan(150);
    expect(first.body.items).toHaveLength(25);
    const ids = new Set(first.body.items.map((t: { id: number }) => t.id));
    expect(second.body.items.some((t: { id: number }) => ids.has(t.id))).toBe(false);
  });

  it('sorts on the server, by a column and by area name', async () => {
    const byPressure = (await traps('?sort=pressureBarg&dir=desc&pageSize=500')).body.items.map((t: { pressureBarg: number }) => t.pressureBarg);
    expect(byPressure).toEqual([...byPressure].sort((a, b) => b - a));
    const byArea = (await traps('?sort=area&pageSize=500')).body.items.map((t: { areaName: string | null }) => t.areaName ?? '');
    expect(byArea).toEqual([...byArea].sort((a, b) => a.localeCompare(b)));
  });

  it('filters by text, area, type and status together', async () => {
    const res = await traps(`?q=FV-EVP&trapType=float_thermostatic&status=in_service&pageSize=500`);
    expect(res.body.total).toBeGreaterThan(0);
    for (const t of res.body.items) {
      expect(t.tag).toContain('FV-EVP');
      expect(t.trapType).toBe('float_thermostatic');
      expect(t.status).toBe('in_service');
    }
    const inArea = await traps(`?areaId=${sites.own.areaId}&pageSize=500`);
    expect(inArea.body.items.every((t: { areaId: number }) => t.areaId === sites.own.areaId)).toBe(true);
  });

  it('refuses bad query parameters with 422 and the field', async () => {
    const res = await traps('?sort=secret&pageSize=100000');
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['pageSize', 'sort']);
  });

  it('validates a new trap with the shared schema, field by field', async () => {
    const res = await analyst.post(`/api/sites/${sites.own.siteId}/traps`, { tag: 'bad tag!', trapType: 'steam_wizard', pressureBarg: -3 });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['pressureBarg', 'tag', 'trapType']);
  });

  it('creates, refuses a duplicate tag with 409, edits, and keeps the trail', async () => {
    const tag = unique('FV-NEW').toUpperCase();
    const created = await analyst.post(`/api/sites/${sites.own.siteId}/traps`, { tag, trapType: 'float_thermostatic', pressureBarg: 8, areaId: sites.own.areaId, sizeDn: 25 });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ tag, areaId: sites.own.areaId, dischargesTo: 'return', status: 'in_service' });
    const again = await analyst.post(`/api/sites/${sites.own.siteId}/traps`, { tag, trapType: 'float_thermostatic', pressureBarg: 8 });
    expect(again.status).toBe(409);
    const edited = await analyst.patch(`/api/traps/${created.body.id}`, { status: 'out_of_service', pressureBarg: 7.5 });
    expect(edited.body).toMatchObject({ status: 'out_of_service', pressureBarg: 7.5, tag });
  });

  it("refuses an area of another site for a trap", async () => {
    const res = await analyst.post(`/api/sites/${sites.own.siteId}/traps`, { tag: unique('X'), trapType: 'inverted_bucket', pressureBarg: 4, areaId: sites.other.areaId });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('areaId');
  });
});

describe('register CSV import', () => {
  let analyst: Client;
  let siteId: number;
  beforeAll(async () => {
    const admin = await signInAdmin();
    const created = await admin.post('/api/sites', { name: unique('Import Site'), code: `IM${Date.now().toString(36).slice(-6).toUpperCase()}`, timeZone: 'Europe/Berlin', currency: 'EUR', unitSystem: 'si' });
    siteId = created.body.id;
    analyst = (await newUser(admin, 'analyst', [siteId])).client;
  });
  const count = async () => (await analyst.get(`/api/sites/${siteId}/traps`)).body.total as number;

  const good = [
    'tag,area,location,trap_type,application,size_dn,orifice_mm,pressure_barg,discharges_to,criticality,status',
    'IM-001,Boiler House,header drip,thermodynamic_disc,drip,15,,10,return,high,in_service',
    'IM-002,Boiler House,,inverted_bucket,drip,20,4.8,10,atmosphere,normal,in_service',
    'IM-003,Tank Farm,tank 2 coil,float_thermostatic,process,25,,6,return,normal,in_service',
  ].join('\n');

  it('previews without writing, then applies all rows with new areas', async () => {
    const preview = await analyst.post(`/api/sites/${siteId}/register-imports/preview`, { csv: good });
    expect(preview.status).toBe(200);
    expect(preview.body.counts).toEqual({ create: 3, update: 0, unchanged: 0, rejected: 0 });
    expect(preview.body.newAreas.sort()).toEqual(['Boiler House', 'Tank Farm']);
    expect(await count()).toBe(0);
    const applied = await analyst.post(`/api/sites/${siteId}/register-imports`, { csv: good });
    expect(applied.status).toBe(200);
    expect(await count()).toBe(3);
    const areas = (await analyst.get(`/api/sites/${siteId}/areas`)).body.items.map((a: { name: string }) => a.name).sort();
    expect(areas).toEqual(['Boiler House', 'Tank Farm']);
  });

  it('upserts by tag, leaves absent columns alone and never deletes', async () => {
    const update = 'tag,pressure_barg,trap_type,status\nIM-002,12,inverted_bucket,removed\nIM-004,3,thermostatic_bimetallic,in_service\n';
    const preview = await analyst.post(`/api/sites/${siteId}/register-imports/preview`, { csv: update });
    expect(preview.body.counts).toMatchObject({ create: 1, update: 1 });
    expect(preview.body.rows.find((r: { tag: string }) => r.tag === 'IM-002').changes).toEqual({ pressureBarg: [10, 12], status: ['in_service', 'removed'] });
    await analyst.post(`/api/sites/${siteId}/register-imports`, { csv: update });
    const list = (await analyst.get(`/api/sites/${siteId}/traps?pageSize=100`)).body.items;
    expect(list.map((t: { tag: string }) => t.tag).sort()).toEqual(['IM-001', 'IM-002', 'IM-003', 'IM-004']);
    const im2 = list.find((t: { tag: string }) => t.tag === 'IM-002');
    expect(im2).toMatchObject({ status: 'removed', pressureBarg: 12, orificeMm: 4.8, dischargesTo: 'atmosphere', areaName: 'Boiler House' });
  });

  it('reports row problems by line and column, and writes nothing unless told to skip them', async () => {
    const bad = [
      'tag,trap_type,pressure_barg,size_dn',
      'IM-010,thermodynamic_disc,8,15',
      'IM-011,steam_wizard,8,15',
      'IM-012,inverted_bucket,lots,20',
      'IM-010,inverted_bucket,8,20',
    ].join('\n');
    const before = await count();
    const preview = await analyst.post(`/api/sites/${siteId}/register-imports/preview`, { csv: bad });
    const problems = preview.body.problems.map((p: { line: number; column: string; code: string }) => [p.line, p.column, p.code]);
    expect(problems).toEqual([[3, 'trap_type', 'invalid_value'], [4, 'pressure_barg', 'invalid_value'], [5, 'tag', 'duplicate_tag']]);
    const refused = await analyst.post(`/api/sites/${siteId}/register-imports`, { csv: bad });
    expect(refused.status).toBe(422);
    expect(refused.body.error.details).toHaveLength(3);
    expect(await count()).toBe(before);
    const skipped = await analyst.post(`/api/sites/${siteId}/register-imports`, { csv: bad, skipRejectedRows: true });
    expect(skipped.status).toBe(200);
    expect(await count()).toBe(before + 1);
  });

  it('blocks a file without a required column, whatever the user accepts', async () => {
    const res = await analyst.post(`/api/sites/${siteId}/register-imports`, { csv: 'tag,area\nIM-099,Boiler House\n', skipRejectedRows: true });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((p: { column: string }) => p.column).sort()).toEqual(['pressure_barg', 'trap_type']);
  });
});

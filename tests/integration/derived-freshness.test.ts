// The review queue, a draft's figures, the register and the test list are kept between requests
// while the data under them stands (lib/services/derived-cache.ts, lib/http/kept-replies.ts). Each
// write below is made once the kept answer is in use, and must show in the very next answer: a
// verdict decided, a test imported, a trap renamed, an area renamed, a decider renamed, cost
// settings changed, a test removed behind the app's back; and the test list's total with them.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { queryDb as query } from '../support/own-server';
import { modelAFileFor, settled, upload } from '../support/uploads';

const queryDb = <T>(sql: string, params: unknown[] = []) => query<T>(inject('dbPath'), sql, params);

type Item = { trapId: number; tag: string; criticality: string; areaName: string | null; latestTestId: number; testCount: number; state: string; verdict: string | null; suggested: string | null; decidedBy: string | null };
type Summary = { figures: { total: { tested: number; decided: number }; byArea: { areaName: string; tested: number }[] } };

describe('derived answers stay fresh', () => {
  let admin: Client;
  let surveyId: number;
  let siteId: number;
  let areaId: number;
  const tags = [unique('DF-A'), unique('DF-B'), unique('DF-C')];
  const queue = async () => {
    const res = await admin.get(`/api/surveys/${surveyId}/review-queue`);
    expect(res.status).toBe(200);
    return res.body as { items: Item[]; total: number; counts: Record<string, number> };
  };
  const summary = async () => {
    const res = await admin.get(`/api/surveys/${surveyId}/summary`);
    expect(res.status).toBe(200);
    return res.body as Summary;
  };
  const testTotal = async () => (await admin.get(`/api/sites/${siteId}/tests?surveyId=${surveyId}&pageSize=1`)).body.total as number;
  const item = async (tag: string) => (await queue()).items.find((i) => i.tag === tag);
  const register = async () => (await admin.get(`/api/sites/${siteId}/traps`)).body.items as { tag: string; criticality: string; areaName: string | null }[];
  /** Asks once for each answer, so the next ones come from what was kept. */
  const keep = async () => {
    await queue();
    await register();
    await summary();
    await testTotal();
  };

  beforeAll(async () => {
    admin = await signInAdmin();
    // A site of its own: writes of other test files to a shared site would move its version.
    const site = (await admin.post('/api/sites', {
      name: unique('Freshness site'), code: `DF${Date.now().toString(36).slice(-6).toUpperCase()}`, timeZone: 'Europe/Berlin', currency: 'EUR', unitSystem: 'si',
    })).body;
    siteId = site.id;
    areaId = (await admin.post(`/api/sites/${siteId}/areas`, { name: 'Boiler house' })).body.id;
    for (const tag of tags) {
      const res = await admin.post(`/api/sites/${siteId}/traps`, { tag, areaId, trapType: 'thermodynamic_disc', pressureBarg: 10, sizeDn: 15 });
      expect(res.status).toBe(201);
    }
    surveyId = (await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Freshness survey'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    const done = await settled(admin, (await upload(admin, surveyId, [modelAFileFor(tags[0]), modelAFileFor(tags[1])])).body.id);
    expect(done.status).toBe('done');
  });

  it('answers from what it kept while nothing it tracks has changed', async () => {
    await keep();
    const before = await item(tags[0]);
    expect(before).toMatchObject({ testCount: 1, state: 'unreviewed', criticality: 'normal' });
    // A raw UPDATE of a trap with the site's count of writes put back as it was is no write the
    // version can see: the kept answers stand, which shows the answers below come from what was
    // kept unless a write moved the count.
    const siteWrites = `UPDATE write_counts SET writes = writes - 1 WHERE subject = 'site' AND subject_id = ?`;
    await queryDb('UPDATE traps SET criticality = ? WHERE id = ?', ['high', before!.trapId]);
    await queryDb(siteWrites, [siteId]);
    try {
      expect((await item(tags[0]))!.criticality).toBe('normal');
      expect((await register()).find((t) => t.tag === tags[0])!.criticality).toBe('normal');
    } finally {
      await queryDb('UPDATE traps SET criticality = ? WHERE id = ?', ['normal', before!.trapId]);
    }
    // The same write, counted: the very next answers show it.
    await queryDb('UPDATE traps SET criticality = ? WHERE id = ?', ['high', before!.trapId]);
    try {
      expect((await item(tags[0]))!.criticality).toBe('high');
      expect((await register()).find((t) => t.tag === tags[0])!.criticality).toBe('high');
    } finally {
      await queryDb('UPDATE traps SET criticality = ? WHERE id = ?', ['normal', before!.trapId]);
    }
  });

  it('sends 304 to a client that has the kept reply, and the new reply once the data changed', async () => {
    const path = `/api/sites/${siteId}/traps`;
    const first = await admin.request('GET', path);
    const etag = first.headers.get('etag');
    expect(etag).toMatch(/^"[\w-]+"$/);
    expect((await admin.request('GET', path, undefined, { 'if-none-match': etag! })).status).toBe(304);
    const trapId = (await item(tags[0]))!.trapId;
    expect((await admin.patch(`/api/traps/${trapId}`, { location: 'Header 3, north' })).status).toBe(200);
    const after = await admin.request('GET', path, undefined, { 'if-none-match': etag! });
    expect(after.status).toBe(200);
    expect(after.headers.get('etag')).not.toBe(etag);
  });

  it('shows a confirmed verdict in the very next queue and figures', async () => {
    await keep();
    const target = (await item(tags[0]))!;
    const decidedBefore = (await summary()).figures.total.decided;
    const res = await admin.post(`/api/surveys/${surveyId}/verdicts`, { trapId: target.trapId, action: 'confirm', testId: target.latestTestId });
    expect(res.status).toBe(200);
    expect(await item(tags[0])).toMatchObject({ state: 'confirmed', verdict: target.suggested });
    expect((await queue()).counts.reviewed).toBe(1);
    expect((await summary()).figures.total.decided).toBe(decidedBefore + 1);
  });

  it('shows an imported test in the very next queue and figures', async () => {
    await keep();
    expect(await item(tags[2])).toBeUndefined();
    const testedBefore = (await summary()).figures.total.tested;
    expect(await testTotal()).toBe(2);
    const done = await settled(admin, (await upload(admin, surveyId, [modelAFileFor(tags[2])])).body.id);
    expect(done.status).toBe('done');
    expect(await item(tags[2])).toMatchObject({ testCount: 1, state: 'unreviewed' });
    expect((await summary()).figures.total.tested).toBe(testedBefore + 1);
    expect(await testTotal()).toBe(3);
  });

  it('shows a renamed trap and a renamed area in the very next answers', async () => {
    await keep();
    const target = (await item(tags[1]))!;
    const renamed = `${tags[1]}-R`;
    expect((await admin.patch(`/api/traps/${target.trapId}`, { tag: renamed })).status).toBe(200);
    expect((await queue()).items.map((i) => i.tag)).toContain(renamed);
    expect(await item(tags[1])).toBeUndefined();

    await keep();
    expect((await admin.patch(`/api/areas/${areaId}`, { name: 'Boiler house east' })).status).toBe(200);
    expect((await item(renamed))!.areaName).toBe('Boiler house east');
    expect((await summary()).figures.byArea.map((a) => a.areaName)).toEqual(['Boiler house east']);
    expect((await register()).find((t) => t.tag === renamed)!.areaName).toBe('Boiler house east');
  });

  it('shows new cost settings and a renamed decider in the very next answers', async () => {
    await keep();
    const costs = (await admin.get(`/api/sites/${siteId}/cost-settings`)).body;
    expect((await admin.request('PUT', `/api/sites/${siteId}/cost-settings`, { ...costs, operatingHoursPerYear: 4321 })).status).toBe(200);
    expect((await admin.get(`/api/surveys/${surveyId}/summary`)).body.settings.operatingHoursPerYear).toBe(4321);

    const decided = (await queue()).items.find((i) => i.state === 'confirmed');
    expect(decided, 'a verdict was confirmed above').toBeDefined();
    const renamed = unique('Renamed decider');
    const [me] = await queryDb<{ id: number; name: string }>('SELECT id, name FROM users WHERE name = ?', [decided!.decidedBy]);
    await queryDb('UPDATE users SET name = ? WHERE id = ?', [renamed, me.id]);
    try {
      expect((await queue()).items.find((i) => i.trapId === decided!.trapId)!.decidedBy).toBe(renamed);
    } finally {
      await queryDb('UPDATE users SET name = ? WHERE id = ?', [me.name, me.id]);
    }
  });

  it('drops a removed test from the very next answers, though no newer stamp was written', async () => {
    await keep();
    const target = (await item(tags[2]))!;
    const testedBefore = (await summary()).figures.total.tested;
    // As a file read again with no test in it leaves it (lib/server/import-batch.ts): no stamp moves,
    // the database's count of writes to the survey's tests does.
    await queryDb('DELETE FROM test_series WHERE test_id = ?', [target.latestTestId]);
    await queryDb('DELETE FROM tests WHERE id = ?', [target.latestTestId]);
    expect(await item(tags[2])).toBeUndefined();
    expect((await summary()).figures.total.tested).toBe(testedBefore - 1);
    expect(await testTotal()).toBe(2);
  });
});

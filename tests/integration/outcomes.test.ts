// Survey figures over HTTP, recomputed by hand from their inputs; cost settings; publishing that
// freezes figures and settings; the site's survey-by-survey view.
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { modelAFileFor, settled, upload } from '../support/uploads';

type Failure = { trapId: number; tag: string; verdict: string; kgPerHour: number; tonnesPerYear: number; costPerYear: number | null; orificeMm: number };

describe('survey outcomes', () => {
  let admin: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  let published: { id: number };
  beforeAll(async () => {
    admin = await signInAdmin();
    sites = await demoSites(admin);
    const surveys = (await admin.get(`/api/sites/${sites.own.siteId}/surveys`)).body.items;
    // The demo's own published spring survey (other tests publish surveys of their own).
    published = surveys.find((s: { status: string; name: string }) => s.status === 'published' && s.name.startsWith('Spring'));
  });

  it('recomputes a published survey\'s figures by hand from its failures (Napier, 24.24 form, in SI)', async () => {
    const { body } = await admin.get(`/api/surveys/${published.id}/summary?failures=all`);
    expect(body.frozen).toBe(true);
    const { total, failures, byArea } = body.figures as { total: Record<string, number>; failures: Failure[]; byArea: Record<string, number>[] };
    expect(failures.length).toBeGreaterThan(0);
    // Totals are the sums of their parts.
    expect(total.lossKgPerHour).toBeCloseTo(failures.reduce((s, f) => s + f.kgPerHour, 0), 6);
    expect(total.tested).toBe(byArea.reduce((s, a) => s + a.tested, 0));
    expect(total.failureRate).toBeCloseTo(total.failed / total.tested, 12);
    // One blowing trap by hand: W [kg/h] = 0.24718 × P [bar abs] × d² [mm²] (the 24.24 lb/h·psia⁻¹·in⁻² form in SI; see
    // ../shared/references/trade-references.md §1.1), severity 1.0 for blow-through (BRIEF §4a).
    const blowing = failures.find((f) => f.verdict === 'blowing')!;
    const trap = (await admin.get(`/api/traps/${blowing.trapId}`)).body;
    const pAbsBar = trap.pressureBarg + 1.01325;
    expect(blowing.kgPerHour).toBeCloseTo(0.24718 * pAbsBar * blowing.orificeMm ** 2, 1);
    const settings = body.settings;
    expect(blowing.tonnesPerYear).toBeCloseTo((blowing.kgPerHour * settings.operatingHoursPerYear) / 1000, 6);
    expect(blowing.costPerYear).toBeCloseTo(blowing.tonnesPerYear * settings.steamPricePerTonne, 6);
    // Leaking traps lose a quarter of a full orifice's flow (BRIEF §4a, after UN CDM AM0017).
    const leaking = failures.find((f) => f.verdict === 'leaking');
    if (leaking) {
      const lt = (await admin.get(`/api/traps/${leaking.trapId}`)).body;
      expect(leaking.kgPerHour).toBeCloseTo(0.25 * 0.24718 * (lt.pressureBarg + 1.01325) * leaking.orificeMm ** 2, 1);
    }
  });

  it('lists the costliest failures first, as many as asked for, and says how many there are', async () => {
    const all = (await admin.get(`/api/surveys/${published.id}/summary?failures=all`)).body.figures as { failures: Failure[]; failureCount: number };
    expect(all.failureCount).toBe(all.failures.length);
    expect(all.failures.length, 'the published demo survey has at least two failures that lose steam').toBeGreaterThanOrEqual(2);
    const two = (await admin.get(`/api/surveys/${published.id}/summary?failures=2`)).body.figures as { failures: Failure[]; failureCount: number };
    expect(two.failures).toEqual(all.failures.slice(0, 2));
    expect(two.failureCount).toBe(all.failures.length);
    const byDefault = (await admin.get(`/api/surveys/${published.id}/summary`)).body.figures as { failures: Failure[] };
    expect(byDefault.failures).toEqual(all.failures.slice(0, 20));
    for (const bad of ['many', '-1', '1001', '2.5']) {
      const res = await admin.get(`/api/surveys/${published.id}/summary?failures=${bad}`);
      expect(res.status, bad).toBe(422);
      expect(res.body.error.details.map((i: { path: string }) => i.path), bad).toEqual(['failures']);
    }
  });

  it('lets a draft follow new cost settings while a published survey keeps its own', async () => {
    const before = (await admin.get(`/api/surveys/${published.id}/summary`)).body;
    const draftSurvey = (await admin.post(`/api/sites/${sites.own.siteId}/surveys`, { name: unique('Draft costs'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body;
    const tag = (await admin.get(`/api/sites/${sites.own.siteId}/traps?q=FV-EVP-02&pageSize=1`)).body.items[0].tag;
    const file = modelAFileFor(tag); // a model A file whose readings blow through (fixtures/meters/model-a, FV-EVP-032)
    await settled(admin, (await upload(admin, draftSurvey.id, [file])).body.id);
    const draftBefore = (await admin.get(`/api/surveys/${draftSurvey.id}/summary`)).body;
    expect(draftBefore.frozen).toBe(false);
    expect(draftBefore.figures.total.failed).toBe(1);

    const current = (await admin.get(`/api/sites/${sites.own.siteId}/cost-settings`)).body;
    const { currency: _c, isDefault: _d, ...settings } = current;
    void _c; void _d;
    const doubled = await admin.request('PUT', `/api/sites/${sites.own.siteId}/cost-settings`, { ...settings, steamPricePerTonne: settings.steamPricePerTonne * 2 });
    expect(doubled.status).toBe(200);
    const draftAfter = (await admin.get(`/api/surveys/${draftSurvey.id}/summary`)).body;
    expect(draftAfter.figures.total.costPerYear).toBeCloseTo(draftBefore.figures.total.costPerYear * 2, 6);
    const after = (await admin.get(`/api/surveys/${published.id}/summary`)).body;
    expect(after.figures).toEqual(before.figures);
    expect(after.settings.steamPricePerTonne).toBe(before.settings.steamPricePerTonne);
    await admin.request('PUT', `/api/sites/${sites.own.siteId}/cost-settings`, settings);
  });

  it('refuses invalid cost settings field by field', async () => {
    const res = await admin.request('PUT', `/api/sites/${sites.own.siteId}/cost-settings`, {
      operatingHoursPerYear: 9000, steamPricePerTonne: -1, fuelPricePerGj: null, boilerEfficiency: 85, feedwaterC: 105, fuel: 'peat', co2KgPerGj: 50, co2FactorSource: '', co2FactorYear: 2016,
    });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['boilerEfficiency', 'co2FactorSource', 'fuel', 'operatingHoursPerYear', 'steamPricePerTonne']);
  });

  it('publishes only when every tested trap is decided, or the rest is accepted, and then freezes', async () => {
    const survey = (await admin.post(`/api/sites/${sites.own.siteId}/surveys`, { name: unique('To publish'), startsOn: '2026-11-01', endsOn: '2026-11-30', status: 'in_progress' })).body;
    await settled(admin, (await upload(admin, survey.id, [modelAFileFor('FV-EVP-044')])).body.id);
    const refused = await admin.post(`/api/surveys/${survey.id}/publish`, {});
    expect(refused.status).toBe(409);
    expect(refused.body.error.details).toEqual({ undecided: 1 });
    const ok = await admin.post(`/api/surveys/${survey.id}/publish`, { acceptUndecided: true });
    expect(ok.status).toBe(200);
    expect(ok.body.frozen).toBe(true);
    const again = await admin.post(`/api/surveys/${survey.id}/publish`, { acceptUndecided: true });
    expect(again.status).toBe(409);
    const item = (await admin.get(`/api/surveys/${survey.id}/review-queue`)).body.items[0];
    expect((await admin.post(`/api/surveys/${survey.id}/verdicts`, { trapId: item.trapId, action: 'retest' })).status).toBe(409);
    expect((await upload(admin, survey.id, [modelAFileFor('FV-EVP-045')])).status).toBe(409);
  });

  it('puts every survey side by side, oldest first, in total and by area', async () => {
    const { body } = await admin.get(`/api/sites/${sites.own.siteId}/trends`);
    const starts = body.surveys.map((s: { startsOn: string }) => s.startsOn);
    expect(starts).toEqual([...starts].sort());
    expect(body.surveys.filter((s: { frozen: boolean }) => s.frozen).length).toBeGreaterThanOrEqual(2);
    for (const area of body.areas) expect(area.bySurvey).toHaveLength(body.surveys.length);
    expect(body.repairs).toMatchObject({ verified: expect.any(Number) });
  });
});

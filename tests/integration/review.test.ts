// The review over HTTP: the queue worst first with its progress, confirming, overriding with a
// reason, asking for a re-test that the next test clears, frozen published surveys, the trail.
import { beforeAll, describe, expect, it } from 'vitest';
import { severityRank, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { fixtureFile, modelAFileFor, settled, upload } from '../support/uploads';

type Item = { trapId: number; tag: string; latestTestId: number; suggested: VerdictCode | null; lossKgPerHour: number | null; state: string; verdict: string | null; hasReference: boolean };

describe('review', () => {
  let analyst: Client;
  let viewer: Client;
  let surveyId: number;
  let siteId: number;
  const queue = async (query = '') => (await analyst.get(`/api/surveys/${surveyId}/review-queue${query}`)).body as { items: Item[]; counts: Record<string, number>; total: number };

  beforeAll(async () => {
    const admin = await signInAdmin();
    const sites = await demoSites(admin);
    siteId = sites.own.siteId;
    // A survey of its own, so other test files' uploads do not move the counts.
    const survey = await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Review survey'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' });
    surveyId = survey.body.id;
    analyst = (await newUser(admin, 'analyst', [siteId])).client;
    viewer = (await newUser(admin, 'viewer', [siteId])).client;
    const files = [
      fixtureFile('model-a/A_FV-EVP-031_20250408T091403.csv'),
      fixtureFile('model-a/A_FV-EVP-031-REF_20250408T091452.csv'),
      fixtureFile('model-a/A_FV-EVP-032_20250408T092010.csv'),
      modelAFileFor('FV-EVP-033'),
      modelAFileFor('FV-EVP-034'),
    ];
    const sent = await upload(analyst, surveyId, files);
    const done = await settled(analyst, sent.body.id);
    expect(done.status).toBe('done');
  });

  it('lists every tested trap worst first, with progress counts and reference readings', async () => {
    const q = await queue();
    expect(q.items.map((i) => i.tag).sort()).toEqual(['FV-EVP-031', 'FV-EVP-032', 'FV-EVP-033', 'FV-EVP-034']);
    expect(q.counts).toEqual({ traps: 4, reviewed: 0, retestPending: 0, unreviewed: 4 });
    const ranks = q.items.map((i) => (i.suggested ? severityRank(i.suggested) : 99));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    expect(q.items.find((i) => i.tag === 'FV-EVP-031')!.hasReference).toBe(true);
    expect(q.items.find((i) => i.tag === 'FV-EVP-032')!.hasReference).toBe(false);
  });

  it('confirms, and a decided verdict changes only with a reason', async () => {
    const item = (await queue()).items.find((i) => i.tag === 'FV-EVP-032')!;
    const confirmed = await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'confirm', testId: item.latestTestId });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body).toMatchObject({ state: 'confirmed', verdict: item.suggested });
    const noReason = await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'confirm', testId: item.latestTestId });
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.details[0].path).toBe('reason');
    const after = (await queue()).items.find((i) => i.tag === 'FV-EVP-032')!;
    expect(after).toMatchObject({ state: 'confirmed', verdict: item.suggested });
  });

  it('overrides with a verdict and a reason, and keeps who, when, from what, to what and why', async () => {
    const item = (await queue()).items.find((i) => i.tag === 'FV-EVP-033')!;
    const missing = await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'override', testId: item.latestTestId, verdict: 'leaking' });
    expect(missing.status).toBe(422);
    const reason = 'outlet line hissing; seat worn on inspection';
    const res = await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'override', testId: item.latestTestId, verdict: 'leaking', reason });
    expect(res.body).toMatchObject({ state: 'overridden', verdict: 'leaking', reason });
    const detail = (await analyst.get(`/api/tests/${item.latestTestId}`)).body;
    expect(detail.decision).toMatchObject({ state: 'overridden', verdict: 'leaking', reason });
    expect(detail.trail[0]).toMatchObject({ action: 'verdict.override', reason, after: { verdict: 'leaking', suggested: item.suggested } });
    expect(detail.trail[0].by).toMatch(/^Test analyst/);
  });

  it('asks for a re-test, which the next trap-point test of that trap clears for review', async () => {
    const item = (await queue()).items.find((i) => i.tag === 'FV-EVP-034')!;
    await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'retest', reason: 'reading too short' });
    expect((await queue('?reviewed=retest')).items.map((i) => i.tag)).toEqual(['FV-EVP-034']);
    expect((await queue()).counts.retestPending).toBe(1);
    const text = Buffer.from(modelAFileFor('FV-EVP-034').bytes as string).toString().replaceAll('2025-04-08T09:2', '2025-04-08T10:2');
    await settled(analyst, (await upload(analyst, surveyId, [{ name: 'A_FV-EVP-034_retest.csv', bytes: text }])).body.id);
    const after = (await queue()).items.find((i) => i.tag === 'FV-EVP-034')!;
    expect(after.state).toBe('unreviewed');
    expect(after.latestTestId).not.toBe(item.latestTestId);
  });

  it('refuses decisions from viewers, on tests of another trap, and on published surveys', async () => {
    const item = (await queue()).items.find((i) => i.tag === 'FV-EVP-031')!;
    expect((await viewer.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'confirm', testId: item.latestTestId })).status).toBe(403);
    const other = (await queue()).items.find((i) => i.tag === 'FV-EVP-032')!;
    const wrong = await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: item.trapId, action: 'confirm', testId: other.latestTestId });
    expect(wrong.status).toBe(422);
    const published = (await analyst.get(`/api/sites/${siteId}/surveys`)).body.items.find((s: { status: string }) => s.status === 'published');
    const frozen = await analyst.post(`/api/surveys/${published.id}/verdicts`, { trapId: item.trapId, action: 'retest' });
    expect(frozen.status).toBe(409);
  });

  it('shows the trap across surveys in its history', async () => {
    const item = (await queue()).items.find((i) => i.tag === 'FV-EVP-033')!;
    const history = (await analyst.get(`/api/traps/${item.trapId}/history`)).body.items;
    const mine = history.find((h: { surveyId: number }) => h.surveyId === surveyId);
    expect(mine.decision).toMatchObject({ state: 'overridden', verdict: 'leaking' });
    expect(mine.tests[0]).toMatchObject({ id: item.latestTestId });
    expect(mine.tests[0].meanLevelDb).toBeGreaterThan(0);
  });
});

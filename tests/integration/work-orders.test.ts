// Work orders over HTTP: made from confirmed failures only, priorities by the rule table, the
// status rules and their refusals, a technician marking done, and a later re-test that verifies
// or re-opens (model A files uploaded into the survey in progress, analysed by the real import).
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { FAILED_VERDICTS, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { workOrderPriority } from '@/lib/outcomes/work-order-priority';
import { demoSites, MODEL_A, newUser, signInAdmin, type SiteIds } from '../support/fixtures';
import { type Client, DEMO, signedIn } from '../support/http';
import { queryDb as query } from '../support/own-server';
import { ensureProfile, settled, upload } from '../support/uploads';
import { freeCandidate, publishedSurveyOf } from './samples/work-orders';

type Kind = 'working' | 'blowing' | 'cold';
const queryDb = <T>(sql: string, params: unknown[] = []) => query<T>(inject('dbPath'), sql, params);
let serial = 0;

/** A model A meter file (our invented layout: ISO UTC time, tag, level dB, surface °C) of one 30 s test at 10 Hz. */
function meterFile(tag: string, kind: Kind, startedAt: Date) {
  const shape = { working: { db: 14, c: 170 }, blowing: { db: 70, c: 172 }, cold: { db: 12, c: 24 } }[kind];
  const rows = ['utc_time,trap_tag,ultrasound_db,surface_temp_c'];
  for (let i = 0; i < 300; i++) {
    const wobble = (((i * 7) % 5) - 2) * 0.4;
    rows.push(`${new Date(startedAt.getTime() + i * 100).toISOString()},${tag},${(shape.db + wobble).toFixed(1)},${(shape.c + wobble / 4).toFixed(1)}`);
  }
  return { name: `A_${tag}_${startedAt.getTime()}_${++serial}.csv`, bytes: rows.join('\n') + '\n' };
}

async function uploadTest(client: Client, surveyId: number, tag: string, kind: Kind, startedAt = new Date()) {
  const sent = await upload(client, surveyId, [meterFile(tag, kind, startedAt)]);
  expect(sent.status, JSON.stringify(sent.body)).toBe(201);
  const done = await settled(client, sent.body.id);
  expect(done.status).toBe('done');
  return done.id as number;
}

async function testsOfUpload(client: Client, siteId: number, uploadId: number) {
  return (await client.get(`/api/sites/${siteId}/tests?uploadId=${uploadId}`)).body.items as { id: number; trapId: number; suggestedVerdict: string }[];
}

describe('work orders', () => {
  let admin: Client;
  let analyst: Client;
  let technician: Client;
  let viewer: Client;
  let own: SiteIds;
  let other: SiteIds;
  let technicianId: number;

  /** A new trap of the own site whose test in the survey in progress the analyst has confirmed failed. */
  async function confirmedFailure(kind: Exclude<Kind, 'working'>, trap: { application?: string; criticality?: string } = {}) {
    const tag = `WO-${Date.now().toString(36).toUpperCase()}-${++serial}`;
    const made = await admin.post(`/api/sites/${own.siteId}/traps`, { tag, trapType: 'thermodynamic_disc', pressureBarg: 8, sizeDn: 15, ...trap });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const uploadId = await uploadTest(analyst, own.surveyId, tag, kind, new Date(Date.now() - 3_600_000));
    const [test] = await testsOfUpload(analyst, own.siteId, uploadId);
    expect(test.suggestedVerdict).toBe(kind);
    const decided = await analyst.post(`/api/surveys/${own.surveyId}/verdicts`, { trapId: made.body.id, action: 'confirm', testId: test.id });
    expect(decided.status, JSON.stringify(decided.body)).toBe(200);
    return { trapId: made.body.id as number, tag };
  }

  async function order(trapId: number, plan: { assigneeId?: number; dueOn?: string } = {}, surveyId = own.surveyId) {
    const res = await analyst.post(`/api/surveys/${surveyId}/work-orders`, { items: [{ trapId, action: 'repair', ...plan }] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.items[0];
  }

  beforeAll(async () => {
    admin = await signInAdmin();
    ({ own, other } = await demoSites(admin));
    await ensureProfile(admin, MODEL_A.file, MODEL_A.name);
    analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password);
    technician = await signedIn(DEMO.technician.email, DEMO.technician.password);
    viewer = await signedIn(DEMO.viewer.email, DEMO.viewer.password);
    technicianId = (await technician.get('/api/me')).body.userId;
  });

  describe('made from confirmed failures only', () => {
    it("lists a published survey's confirmed failures, and nothing else", async () => {
      const surveyId = await publishedSurveyOf(admin, own.siteId);
      const candidates = (await analyst.get(`/api/surveys/${surveyId}/work-order-candidates`)).body;
      const queue = (await analyst.get(`/api/surveys/${surveyId}/review-queue?pageSize=5000`)).body.items as { trapId: number; state: string; verdict: string | null }[];
      const confirmedFailed = queue.filter((q) => (q.state === 'confirmed' || q.state === 'overridden') && FAILED_VERDICTS.has(q.verdict as VerdictCode));
      expect(confirmedFailed.length).toBeGreaterThan(0);
      expect(candidates.items.map((c: { trapId: number }) => c.trapId).sort()).toEqual(confirmedFailed.map((q) => q.trapId).sort());
      expect(candidates.technicians.map((t: { id: number }) => t.id)).toContain(technicianId);
    });

    it('refuses a trap whose verdict is not a confirmed failure', async () => {
      const surveyId = await publishedSurveyOf(admin, own.siteId);
      const queue = (await analyst.get(`/api/surveys/${surveyId}/review-queue?pageSize=5000`)).body.items as { trapId: number; verdict: string | null }[];
      const working = queue.find((q) => q.verdict === 'working')!;
      const res = await analyst.post(`/api/surveys/${surveyId}/work-orders`, { items: [{ trapId: working.trapId, action: 'repair' }] });
      expect(res.status).toBe(422);
      expect(res.body.error.details[0]).toMatchObject({ path: 'items.0.trapId', message: expect.stringContaining('Not a confirmed failure') });
    });

    it('refuses a failure that is only suggested, not yet confirmed', async () => {
      const tag = `WO-UNCONF-${++serial}`;
      const trap = (await admin.post(`/api/sites/${own.siteId}/traps`, { tag, trapType: 'thermodynamic_disc', pressureBarg: 8 })).body;
      const uploadId = await uploadTest(analyst, own.surveyId, tag, 'blowing', new Date(Date.now() - 3_600_000));
      expect((await testsOfUpload(analyst, own.siteId, uploadId))[0].suggestedVerdict).toBe('blowing');
      const res = await analyst.post(`/api/surveys/${own.surveyId}/work-orders`, { items: [{ trapId: trap.id }] });
      expect(res.status).toBe(422);
    });

    it('makes many at once, refuses a second active order for the same trap, and a technician of another site', async () => {
      const a = await confirmedFailure('blowing');
      const b = await confirmedFailure('blowing');
      const res = await analyst.post(`/api/surveys/${own.surveyId}/work-orders`, {
        items: [{ trapId: a.trapId, action: 'repair' }, { trapId: b.trapId, action: 'replace', assigneeId: technicianId, dueOn: '2030-06-30' }],
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.items.map((o: { tag: string; status: string; action: string }) => [o.tag, o.status, o.action]))
        .toEqual([[a.tag, 'open', 'repair'], [b.tag, 'scheduled', 'replace']]);
      const again = await analyst.post(`/api/surveys/${own.surveyId}/work-orders`, { items: [{ trapId: a.trapId }] });
      expect(again.status).toBe(409);
      expect(again.body.error.message).toContain(`${a.tag} already has work order #${res.body.items[0].id}`);
      const c = await confirmedFailure('blowing');
      const stranger = await newUser(admin, 'technician', [other.siteId]);
      const wrong = await analyst.post(`/api/surveys/${own.surveyId}/work-orders`, { items: [{ trapId: c.trapId, assigneeId: stranger.id, dueOn: '2030-01-01' }] });
      expect(wrong.status).toBe(422);
      expect(wrong.body.error.details[0]).toMatchObject({ path: 'items.0.assigneeId' });
    });

    it('the database itself holds one active order per trap and survey, as another instance would find', async () => {
      const a = await confirmedFailure('blowing');
      const made = await order(a.trapId);
      // A second order for the same trap and survey written behind the service's check, as a
      // second instance racing the first would: refused while the first is active…
      const copy = `INSERT INTO work_orders (site_id, survey_id, trap_id, verdict, action, priority, status, created_at, updated_at)
        SELECT site_id, survey_id, trap_id, verdict, action, priority, 'open', created_at, updated_at FROM work_orders WHERE id = ?`;
      await expect(queryDb(copy, [made.id])).rejects.toThrow(/unique|UNIQUE/);
      // …and taken once it is verified (closed): a trap that fails again gets a new order.
      await queryDb("UPDATE work_orders SET status = 'verified' WHERE id = ?", [made.id]);
      await queryDb(copy, [made.id]);
      const rows = await queryDb<{ status: string }>('SELECT status FROM work_orders WHERE trap_id = ? ORDER BY id', [a.trapId]);
      expect(rows.map((r) => r.status)).toEqual(['verified', 'open']);
    });
  });

  describe('priority', () => {
    it('follows the rule table for every candidate, and the order keeps the priority and its reason', async () => {
      const surveyId = await publishedSurveyOf(admin, own.siteId);
      const { items, currency } = (await analyst.get(`/api/surveys/${surveyId}/work-order-candidates`)).body;
      for (const c of items) {
        const expected = workOrderPriority({ verdict: c.verdict, application: c.application, criticality: c.criticality, costPerYear: c.costPerYear ?? (c.kgPerHour === null ? 0 : null), kgPerHour: c.kgPerHour ?? 0, currency });
        expect([c.tag, c.priority, c.priorityReason]).toEqual([c.tag, expected.priority, expected.reason]);
      }
      const free = items.find((c: { order: unknown }) => !c.order) ?? (await freeCandidate(admin, own.siteId));
      const made = await order(free.trapId, {}, free.surveyId ?? surveyId);
      const expected = (await analyst.get(`/api/surveys/${free.surveyId ?? surveyId}/work-order-candidates`)).body.items.find((c: { trapId: number }) => c.trapId === free.trapId);
      expect([made.priority, made.priorityReason]).toEqual([expected.priority, expected.priorityReason]);
      expect((await analyst.get(`/api/work-orders/${made.id}`)).body.priorityReason).toBe(expected.priorityReason);
    });

    it('ranks a cold trap draining a steam main high, even at low criticality and no steam lost', async () => {
      const drip = await confirmedFailure('cold', { application: 'drip', criticality: 'low' });
      const tracer = await confirmedFailure('cold', { application: 'tracer', criticality: 'low' });
      const { items } = (await analyst.get(`/api/surveys/${own.surveyId}/work-order-candidates`)).body;
      const of = (trapId: number) => items.find((c: { trapId: number }) => c.trapId === trapId);
      expect(of(drip.trapId).priority).toBe('high');
      expect(of(drip.trapId).priorityReason).toContain('water hammer');
      expect(of(tracer.trapId).priority).toBe('low');
      const made = await order(drip.trapId);
      expect(made.priority).toBe('high');
      expect(made.priorityReason).toContain('water hammer');
    });
  });

  describe('status rules', () => {
    it('open → scheduled → done, with refusals for the transitions the rules do not allow', async () => {
      const f = await confirmedFailure('blowing');
      const made = await order(f.trapId);
      expect(made.status).toBe('open');

      const early = await technician.post(`/api/work-orders/${made.id}/done`, { repairCost: 90 });
      expect(early.status).toBe(409);
      expect(early.body.error.message).toContain('not scheduled yet');
      const half = await analyst.patch(`/api/work-orders/${made.id}`, { status: 'scheduled', assigneeId: technicianId });
      expect(half.status).toBe(409);
      expect(half.body.error.message).toContain('technician and a due date');
      const byHand = await analyst.patch(`/api/work-orders/${made.id}`, { status: 'verified' });
      expect(byHand.status).toBe(409);
      expect(byHand.body.error.message).toContain('Only a passing re-test verifies');

      const planned = await analyst.patch(`/api/work-orders/${made.id}`, { assigneeId: technicianId, dueOn: '2030-03-31' });
      expect(planned.status, JSON.stringify(planned.body)).toBe(200);
      expect(planned.body).toMatchObject({ status: 'scheduled', assigneeId: technicianId, dueOn: '2030-03-31' });

      // The technician sees it among their own, may not re-plan it, and marks it done.
      const mine = (await technician.get(`/api/sites/${own.siteId}/work-orders?mine=true`)).body.items as { id: number; assigneeId: number }[];
      expect(mine.map((o) => o.id)).toContain(made.id);
      expect(mine.every((o) => o.assigneeId === technicianId)).toBe(true);
      expect((await technician.patch(`/api/work-orders/${made.id}`, { dueOn: '2031-01-01' })).status).toBe(403);
      expect((await viewer.post(`/api/work-orders/${made.id}/done`, {})).status).toBe(403);
      const done = await technician.post(`/api/work-orders/${made.id}/done`, { repairCost: 185.5, notes: 'Replaced the disc; seat lapped.' });
      expect(done.status, JSON.stringify(done.body)).toBe(200);
      expect(done.body).toMatchObject({ status: 'done', repairCost: 185.5, notes: 'Replaced the disc; seat lapped.', doneBy: 'Demo Technician' });

      const twice = await technician.post(`/api/work-orders/${made.id}/done`, {});
      expect(twice.status).toBe(409);
      expect(twice.body.error.message).toContain('already done');
      const replan = await analyst.patch(`/api/work-orders/${made.id}`, { assigneeId: null });
      expect(replan.status).toBe(409);
      expect(replan.body.error.message).toContain('waits for its re-test');

      const trail = (await analyst.get(`/api/work-orders/${made.id}`)).body.trail.map((e: { action: string }) => e.action);
      expect(trail).toEqual(['workorder.done', 'workorder.update', 'workorder.create']);
    });

    it("answers 404 for another site's work order", async () => {
      const free = await freeCandidate(admin, other.siteId);
      const theirs = (await admin.post(`/api/surveys/${free.surveyId}/work-orders`, { items: [{ trapId: free.trapId }] })).body.items[0];
      expect((await technician.get(`/api/work-orders/${theirs.id}`)).status).toBe(404);
      expect((await technician.post(`/api/work-orders/${theirs.id}/done`, {})).status).toBe(404);
      expect((await viewer.get(`/api/work-orders/${theirs.id}`)).status).toBe(404);
    });
  });

  describe('re-tests', () => {
    async function doneOrder(kind: 'blowing' | 'cold' = 'blowing') {
      const f = await confirmedFailure(kind);
      const made = await order(f.trapId, { assigneeId: technicianId, dueOn: '2030-02-28' });
      expect((await technician.post(`/api/work-orders/${made.id}/done`, { repairCost: 120 })).status).toBe(200);
      return { ...f, id: made.id as number };
    }

    it('a passing re-test taken after the work, in a later upload, verifies the order', async () => {
      const o = await doneOrder();
      // A test from before the work was done, even uploaded later, decides nothing.
      await uploadTest(technician, own.surveyId, o.tag, 'working', new Date(Date.now() - 86_400_000));
      expect((await analyst.get(`/api/work-orders/${o.id}`)).body.status).toBe('done');

      const uploadId = await uploadTest(technician, own.surveyId, o.tag, 'working', new Date(Date.now() + 1000));
      const [retest] = await testsOfUpload(technician, own.siteId, uploadId);
      expect(retest.suggestedVerdict).toBe('working');
      const after = (await analyst.get(`/api/work-orders/${o.id}`)).body;
      expect(after).toMatchObject({ status: 'verified', verifiedByTestId: retest.id });
      expect(after.trail[0]).toMatchObject({ action: 'workorder.verify', by: 'system', reason: `Re-test #${retest.id} suggests working.` });
      const closed = await analyst.patch(`/api/work-orders/${o.id}`, { notes: 'late note' });
      expect(closed.status).toBe(409);
      expect(closed.body.error.message).toContain('verified by a re-test and closed');
    });

    it('a failing re-test re-opens it; the work is done again and the next passing re-test verifies it', async () => {
      const o = await doneOrder();
      await uploadTest(technician, own.surveyId, o.tag, 'blowing', new Date(Date.now() + 1000));
      const reopened = (await analyst.get(`/api/work-orders/${o.id}`)).body;
      expect(reopened.status).toBe('reopened');
      expect(reopened.trail[0]).toMatchObject({ action: 'workorder.reopen', reason: expect.stringContaining('blowing') });
      expect((await analyst.patch(`/api/work-orders/${o.id}`, { status: 'open' })).status).toBe(409);

      expect((await technician.post(`/api/work-orders/${o.id}/done`, { notes: 'Second attempt: new trap fitted.' })).status).toBe(200);
      await uploadTest(technician, own.surveyId, o.tag, 'working', new Date(Date.now() + 1000));
      expect((await analyst.get(`/api/work-orders/${o.id}`)).body.status).toBe('verified');
    });

    it('shows on the trap page', async () => {
      const o = await doneOrder();
      const page = await analyst.get(`/sites/${own.siteId}/traps/${o.trapId}`);
      expect(page.status).toBe(200);
      expect(page.body).toContain('data-testid="trap-work-orders"');
      expect(page.body).toContain(`/sites/${own.siteId}/work-orders/${o.id}`);
    });
  });
});

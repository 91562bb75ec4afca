import 'server-only';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { isVerdictCode, severityRank, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { writeTransaction } from '@/lib/db';
import type { TrapType } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import { Area, Survey, Test, Trap, TrapVerdict, User } from '@/models';
import { auditTrail, recordAudit } from './audit';

export type ReviewState = 'unreviewed' | 'confirmed' | 'overridden' | 'retest_pending';

export type QueueFilter = {
  page: number; pageSize: number; uploadId?: number; areaId?: number; trapType?: TrapType;
  verdict?: VerdictCode; reviewed?: 'yes' | 'no' | 'retest';
};

type LatestTest = Pick<Test, 'id' | 'trapId' | 'startedAt' | 'createdAt' | 'suggestedVerdict' | 'confidence' | 'lossKgPerHour' | 'meanLevelDb' | 'dutyCycle'>;

/** A decision stands until a re-test is asked for; a test made after that request is reviewed in turn. */
export function reviewState(decision: TrapVerdict | undefined, latest: { createdAt: Date }): ReviewState {
  if (!decision) return 'unreviewed';
  if (decision.state === 'retest') {
    return decision.retestRequestedAt && latest.createdAt > decision.retestRequestedAt ? 'unreviewed' : 'retest_pending';
  }
  return decision.state;
}

const rankOf = (code: string | null) => (isVerdictCode(code) ? severityRank(code) : 99);

/**
 * Every trap tested in a survey, worst first (suggested verdict severity, then estimated loss),
 * with where its review stands. A survey holds at most a few thousand traps, so the queue is
 * assembled in memory from indexed reads of the columns it needs.
 */
export async function reviewQueue(surveyId: number, f: QueueFilter) {
  const tests = (await Test.findAll({
    where: { surveyId, role: 'trap', matchStatus: 'matched', ...(f.uploadId ? { uploadId: f.uploadId } : {}) },
    attributes: ['id', 'trapId', 'startedAt', 'createdAt', 'suggestedVerdict', 'confidence', 'lossKgPerHour', 'meanLevelDb', 'dutyCycle'],
    raw: true,
  })) as unknown as LatestTest[];
  // Raw rows (no model instances: surveys hold thousands of tests) may carry dates as text.
  for (const t of tests) {
    t.startedAt = new Date(t.startedAt);
    t.createdAt = new Date(t.createdAt);
  }
  const latest = new Map<number, LatestTest>();
  const testCount = new Map<number, number>();
  for (const t of tests) {
    const id = t.trapId!;
    testCount.set(id, (testCount.get(id) ?? 0) + 1);
    const seen = latest.get(id);
    if (!seen || t.startedAt > seen.startedAt) latest.set(id, t);
  }
  const trapIds = [...latest.keys()];
  const [traps, decisions, references] = await Promise.all([
    Trap.findAll({ where: { id: { [Op.in]: trapIds } }, include: [{ model: Area, as: 'area', attributes: ['name'] }] }),
    TrapVerdict.findAll({ where: { surveyId }, include: [{ model: User, as: 'decider', attributes: ['name'] }] }),
    Test.findAll({ where: { surveyId, role: 'reference', trapId: { [Op.in]: trapIds } }, attributes: ['trapId'] }),
  ]);
  const decisionOf = new Map(decisions.map((d) => [d.trapId, d]));
  const withReference = new Set(references.map((r) => r.trapId));
  let items = traps.map((trap) => {
    const t = latest.get(trap.id)!;
    const d = decisionOf.get(trap.id);
    const state = reviewState(d, t);
    return {
      trapId: trap.id, tag: trap.tag, areaId: trap.areaId ?? null, areaName: trap.area?.name ?? null, trapType: trap.trapType,
      pressureBarg: trap.pressureBarg, criticality: trap.criticality, latestTestId: t.id, testCount: testCount.get(trap.id) ?? 0,
      hasReference: withReference.has(trap.id), suggested: t.suggestedVerdict, confidence: t.confidence,
      lossKgPerHour: t.lossKgPerHour, meanLevelDb: t.meanLevelDb, dutyCycle: t.dutyCycle, state,
      verdict: state === 'confirmed' || state === 'overridden' ? d!.verdict : null,
      reason: d?.reason ?? null, decidedBy: (d as TrapVerdict & { decider?: User })?.decider?.name ?? null,
      decidedAt: d?.decidedAt?.toISOString() ?? null,
    };
  });
  const counts = {
    traps: items.length,
    reviewed: items.filter((i) => i.state === 'confirmed' || i.state === 'overridden').length,
    retestPending: items.filter((i) => i.state === 'retest_pending').length,
    unreviewed: items.filter((i) => i.state === 'unreviewed').length,
  };
  if (f.areaId) items = items.filter((i) => i.areaId === f.areaId);
  if (f.trapType) items = items.filter((i) => i.trapType === f.trapType);
  if (f.verdict) items = items.filter((i) => (i.verdict ?? i.suggested) === f.verdict);
  if (f.reviewed === 'yes') items = items.filter((i) => i.state === 'confirmed' || i.state === 'overridden');
  if (f.reviewed === 'no') items = items.filter((i) => i.state === 'unreviewed');
  if (f.reviewed === 'retest') items = items.filter((i) => i.state === 'retest_pending');
  items.sort((a, b) => rankOf(a.suggested) - rankOf(b.suggested) || (b.lossKgPerHour ?? 0) - (a.lossKgPerHour ?? 0) || a.tag.localeCompare(b.tag));
  const total = items.length;
  return { items: items.slice((f.page - 1) * f.pageSize, f.page * f.pageSize), total, page: f.page, pageSize: f.pageSize, counts };
}
export type ReviewQueue = Awaited<ReturnType<typeof reviewQueue>>;
export type ReviewItem = ReviewQueue['items'][number];

export type Decision =
  | { trapId: number; action: 'confirm'; testId: number; reason?: string }
  | { trapId: number; action: 'override'; testId: number; verdict: VerdictCode; reason: string }
  | { trapId: number; action: 'retest'; reason?: string };

function snapshot(d: TrapVerdict | null) {
  return d ? { state: d.state, verdict: d.verdict, suggested: d.suggested, testId: d.testId, reason: d.reason } : null;
}

/** Confirm or override a trap's verdict, or ask for a re-test. Every change lands with its audit event. */
export async function decideVerdict(actor: Actor, surveyId: number, decision: Decision) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  if (survey.status === 'published') throw new AppError('conflict', `${survey.name} is published; its verdicts are frozen.`);
  const trap = await Trap.findByPk(decision.trapId);
  if (!trap || trap.siteId !== survey.siteId) {
    throw new AppError('invalid', 'Invalid request body.', [{ path: 'trapId', message: 'No such trap on this survey\'s site.' }]);
  }
  let test: Test | null = null;
  if (decision.action !== 'retest') {
    test = await Test.findByPk(decision.testId);
    if (!test || test.surveyId !== surveyId || test.trapId !== trap.id || test.role !== 'trap') {
      throw new AppError('invalid', 'Invalid request body.', [{ path: 'testId', message: 'Not a trap-point test of this trap in this survey.' }]);
    }
  }
  return writeTransaction(async (transaction) => {
    const existing = await TrapVerdict.findOne({ where: { surveyId, trapId: trap.id }, transaction });
    const decided = existing && (existing.state === 'confirmed' || existing.state === 'overridden');
    const reason = decision.reason?.trim() || null;
    if (decided && decision.action !== 'retest' && !reason) {
      throw new AppError('invalid', 'This verdict is already decided: changing it needs a reason.', [{ path: 'reason', message: 'Say why the verdict changes.' }]);
    }
    const now = new Date();
    const values =
      decision.action === 'retest'
        ? { state: 'retest' as const, verdict: null, testId: existing?.testId ?? null, suggested: existing?.suggested ?? null, reason, retestRequestedAt: now, retestRequestedBy: actor.userId, decidedBy: actor.userId, decidedAt: now }
        : {
            state: decision.action === 'confirm' ? ('confirmed' as const) : ('overridden' as const),
            verdict: decision.action === 'confirm' ? (test!.suggestedVerdict as VerdictCode | null) : decision.verdict,
            suggested: test!.suggestedVerdict as VerdictCode | null, testId: test!.id, reason, decidedBy: actor.userId, decidedAt: now,
          };
    if (decision.action === 'confirm' && !values.verdict) {
      throw new AppError('invalid', 'This test has no suggested verdict to confirm; override it with a verdict and a reason.');
    }
    const before = snapshot(existing);
    const row = existing
      ? await existing.update(values, { transaction })
      : await TrapVerdict.create({ siteId: survey.siteId, surveyId, trapId: trap.id, retestRequestedAt: null, retestRequestedBy: null, ...values }, { transaction });
    await recordAudit(actor, {
      siteId: survey.siteId, action: `verdict.${decision.action}`, entityType: 'trap_verdict', entityId: row.id,
      before, after: snapshot(row), reason,
    }, transaction);
    return { trapId: trap.id, surveyId, state: row.state === 'retest' ? 'retest_pending' : row.state, verdict: row.verdict, reason: row.reason };
  });
}


/** One test with everything its review shows: figures, trap, the reference test, the trap's decision and its trail. */
export async function testDetail(testId: number) {
  const test = await Test.findByPk(testId);
  if (!test) throw notFound('test');
  const trap = test.trapId ? await Trap.findByPk(test.trapId, { include: [{ model: Area, as: 'area', attributes: ['name'] }] }) : null;
  const figures = (test.figures ?? {}) as { reference?: { startedAt?: string | null; tag?: string | null } };
  const referenceTest = test.role === 'trap' && figures.reference?.startedAt
    ? await Test.findOne({ where: { surveyId: test.surveyId, role: 'reference', startedAt: new Date(figures.reference.startedAt) }, attributes: ['id'] })
    : null;
  const decision = trap ? await TrapVerdict.findOne({ where: { surveyId: test.surveyId, trapId: trap.id }, include: [{ model: User, as: 'decider', attributes: ['name'] }] }) : null;
  const siblings = trap
    ? await Test.findAll({ where: { surveyId: test.surveyId, trapId: trap.id }, attributes: ['id', 'role', 'startedAt', 'suggestedVerdict'], order: [['startedAt', 'ASC']] })
    : [];
  const survey = await Survey.findByPk(test.surveyId, { attributes: ['id', 'name', 'status'] });
  return {
    test: {
      id: test.id, siteId: test.siteId, surveyId: test.surveyId, uploadId: test.uploadId, tag: test.tag, role: test.role,
      linkedTrapTag: test.linkedTrapTag, startedAt: test.startedAt.toISOString(), durationS: test.durationS,
      sampleRateHz: test.sampleRateHz, sampleCount: test.sampleCount, suggestedVerdict: test.suggestedVerdict,
      confidence: test.confidence, lossKgPerHour: test.lossKgPerHour, figures: test.figures,
    },
    survey: survey ? { id: survey.id, name: survey.name, status: survey.status } : null,
    trap: trap ? { id: trap.id, tag: trap.tag, areaName: trap.area?.name ?? null, trapType: trap.trapType, pressureBarg: trap.pressureBarg, sizeDn: trap.sizeDn, criticality: trap.criticality, status: trap.status } : null,
    referenceTestId: referenceTest?.id ?? null,
    decision: decision && test ? {
      state: reviewState(decision, test), verdict: decision.verdict, reason: decision.reason, testId: decision.testId,
      decidedBy: (decision as TrapVerdict & { decider?: User }).decider?.name ?? null, decidedAt: decision.decidedAt?.toISOString() ?? null,
    } : null,
    trail: decision ? await auditTrail('trap_verdict', decision.id) : [],
    otherTests: siblings.map((s) => ({ id: s.id, role: s.role, startedAt: s.startedAt.toISOString(), suggestedVerdict: s.suggestedVerdict })),
  };
}
export type TestDetail = Awaited<ReturnType<typeof testDetail>>;

/** A trap across every survey of its site: each survey's trap-point tests and the decision on it. */
export async function trapHistory(trapId: number) {
  const trap = await Trap.findByPk(trapId);
  if (!trap) throw notFound('trap');
  const [surveys, tests, decisions] = await Promise.all([
    Survey.findAll({ where: { siteId: trap.siteId }, order: [['startsOn', 'ASC']] }),
    Test.findAll({ where: { trapId, role: 'trap' }, attributes: ['id', 'surveyId', 'startedAt', 'meanLevelDb', 'dutyCycle', 'suggestedVerdict', 'lossKgPerHour', 'figures'], order: [['startedAt', 'ASC']] }),
    TrapVerdict.findAll({ where: { trapId } }),
  ]);
  return surveys
    .map((s) => {
      const mine = tests.filter((t) => t.surveyId === s.id);
      const d = decisions.find((x) => x.surveyId === s.id);
      return {
        surveyId: s.id, surveyName: s.name, startsOn: s.startsOn, status: s.status,
        decision: d ? { state: d.state, verdict: d.verdict, reason: d.reason } : null,
        tests: mine.map((t) => {
          const temperature = (t.figures as { temperature?: { meanC?: number | null } } | null)?.temperature;
          return {
            id: t.id, startedAt: t.startedAt.toISOString(), meanLevelDb: t.meanLevelDb, dutyCycle: t.dutyCycle,
            suggestedVerdict: t.suggestedVerdict, lossKgPerHour: t.lossKgPerHour, meanTemperatureC: temperature?.meanC ?? null,
          };
        }),
      };
    })
    .filter((s) => s.tests.length > 0 || s.decision);
}
export type TrapHistory = Awaited<ReturnType<typeof trapHistory>>;

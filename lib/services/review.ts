import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { isVerdictCode, severityRank, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { sequelize, writeTransaction } from '@/lib/db';
import type { TrapType } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import { Area, Survey, Test, Trap, TrapVerdict, User } from '@/models';
import { auditTrail, recordAudit } from './audit';
import { DerivedCache, surveyDataVersion } from './derived-cache';

export type ReviewState = 'unreviewed' | 'confirmed' | 'overridden' | 'retest_pending';

export type QueueFilter = {
  page: number; pageSize: number; uploadId?: number; areaId?: number; trapType?: TrapType;
  verdict?: VerdictCode; reviewed?: 'yes' | 'no' | 'retest';
};

/** A decision stands until a re-test is asked for; a test made after that request is reviewed in turn. */
export function reviewState(
  decision: Pick<TrapVerdict, 'state' | 'retestRequestedAt'> | undefined, latest: { createdAt: Date },
): ReviewState {
  if (!decision) return 'unreviewed';
  if (decision.state === 'retest') {
    return decision.retestRequestedAt && latest.createdAt > decision.retestRequestedAt ? 'unreviewed' : 'retest_pending';
  }
  return decision.state;
}

const rankOf = (code: string | null) => (isVerdictCode(code) ? severityRank(code) : 99);
const byTag = new Intl.Collator().compare;
/** Raw rows carry dates as text on SQLite and as Date on PostgreSQL. */
const dateOf = (v: Date | string | null) => (v === null ? null : new Date(v));

/** A trap's latest trap-point test in a survey (by start; the first stored of equal starts) and how many it has. */
export type LatestTest = {
  trapId: number; testId: number; testCount: number; createdAt: Date; suggestedVerdict: string | null; confidence: string | null;
  lossKgPerHour: number | null; meanLevelDb: number | null; dutyCycle: number | null; lossMode: string | null;
};

type LatestRow = {
  trap_id: number; n: number | string; test_id: number; created_at: Date | string; suggested_verdict: string | null; confidence: string | null;
  loss_kg_per_hour: number | null; mean_level_db: number | null; duty_cycle: number | null; loss_mode: string | null;
};

/**
 * Each trap's latest matched trap-point test of a survey, with its count of them. The database
 * groups the survey's tests by trap from the index tests_survey_role_trap and reads only the
 * latest row of each. `extra` adds columns of joined tables (aliases `tr` for the trap, `a` for its area).
 */
async function latestTestRows<X>(surveyId: number, uploadId: number | undefined, extra: { columns: string; joins: string } = { columns: '', joins: '' }) {
  const match = (t: string) => `${t}survey_id = :surveyId AND ${t}role = 'trap' AND ${t}match_status = 'matched'${uploadId ? ` AND ${t}upload_id = :uploadId` : ''}`;
  // A LEFT JOIN keeps SQLite reading the groups first and looking up one row each; every group has its row.
  const rows = await sequelize.query<LatestRow & X>(
    `SELECT c.trap_id, c.n, t.id AS test_id, t.created_at, t.suggested_verdict, t.confidence, t.loss_kg_per_hour,
            t.mean_level_db, t.duty_cycle, t.loss_mode${extra.columns}
     FROM (SELECT trap_id, MAX(started_at) AS latest, COUNT(*) AS n FROM tests WHERE ${match('')} AND trap_id IS NOT NULL GROUP BY trap_id) c
     LEFT JOIN tests t ON ${match('t.')} AND t.trap_id = c.trap_id AND t.started_at = c.latest${extra.joins}`,
    { replacements: { surveyId, uploadId: uploadId ?? null }, type: QueryTypes.SELECT },
  );
  const latest = new Map<number, LatestRow & X>();
  for (const r of rows) {
    const seen = latest.get(r.trap_id);
    if (!seen || r.test_id < seen.test_id) latest.set(r.trap_id, r);
  }
  return latest;
}

const latestOf = (r: LatestRow): LatestTest => ({
  trapId: r.trap_id, testId: r.test_id, testCount: Number(r.n), createdAt: new Date(r.created_at), suggestedVerdict: r.suggested_verdict,
  confidence: r.confidence, lossKgPerHour: r.loss_kg_per_hour, meanLevelDb: r.mean_level_db, dutyCycle: r.duty_cycle, lossMode: r.loss_mode,
});

/** Each trap's latest trap-point test of a survey, by trap id. */
export async function latestTrapTests(surveyId: number): Promise<Map<number, LatestTest>> {
  return new Map([...(await latestTestRows(surveyId, undefined)).values()].map((r) => [r.trap_id, latestOf(r)]));
}

export type SurveyDecision = Pick<TrapVerdict, 'state' | 'verdict' | 'reason'> & {
  trapId: number; decidedBy: number | null; decidedAt: Date | null; retestRequestedAt: Date | null;
};

/** The analyst's decisions of a survey, by trap id. */
export async function surveyDecisions(surveyId: number): Promise<Map<number, SurveyDecision>> {
  const rows = (await TrapVerdict.findAll({
    where: { surveyId }, attributes: ['trapId', 'state', 'verdict', 'reason', 'decidedBy', 'decidedAt', 'retestRequestedAt'], raw: true,
  })) as unknown as (Omit<SurveyDecision, 'decidedAt' | 'retestRequestedAt'> & { decidedAt: Date | string | null; retestRequestedAt: Date | string | null })[];
  return new Map(rows.map((d) => [d.trapId, { ...d, decidedAt: dateOf(d.decidedAt), retestRequestedAt: dateOf(d.retestRequestedAt) }]));
}

type TrapColumns = { tag: string; area_id: number | null; area_name: string | null; trap_type: TrapType; pressure_barg: number; criticality: string };

/** Every trap tested in the survey (of the upload), sorted worst first, with its review state; who decided is an id. */
async function queueOf(surveyId: number, uploadId: number | undefined) {
  const [latest, decisions, references] = await Promise.all([
    latestTestRows<TrapColumns>(surveyId, uploadId, {
      columns: ', tr.tag, tr.area_id, a.name AS area_name, tr.trap_type, tr.pressure_barg, tr.criticality',
      joins: ' JOIN traps tr ON tr.id = c.trap_id LEFT JOIN areas a ON a.id = tr.area_id',
    }),
    surveyDecisions(surveyId),
    // Without DISTINCT, which would lead SQLite to walk tests_survey_trap and read every row for its role.
    sequelize.query<{ trap_id: number | null }>(
      "SELECT trap_id FROM tests WHERE survey_id = :surveyId AND role = 'reference'",
      { replacements: { surveyId }, type: QueryTypes.SELECT },
    ),
  ]);
  const withReference = new Set(references.map((r) => r.trap_id));
  const items = [...latest.values()].map((r) => {
    const t = latestOf(r);
    const d = decisions.get(t.trapId);
    const state = reviewState(d, t);
    return {
      trapId: t.trapId, tag: r.tag, areaId: r.area_id ?? null, areaName: r.area_name ?? null, trapType: r.trap_type,
      pressureBarg: r.pressure_barg, criticality: r.criticality, latestTestId: t.testId, testCount: t.testCount,
      hasReference: withReference.has(t.trapId), suggested: t.suggestedVerdict, confidence: t.confidence,
      lossKgPerHour: t.lossKgPerHour, meanLevelDb: t.meanLevelDb, dutyCycle: t.dutyCycle, state,
      verdict: state === 'confirmed' || state === 'overridden' ? d!.verdict : null,
      reason: d?.reason ?? null, decidedById: d?.decidedBy ?? null, decidedAt: d?.decidedAt?.toISOString() ?? null,
    };
  });
  items.sort((a, b) => rankOf(a.suggested) - rankOf(b.suggested) || (b.lossKgPerHour ?? 0) - (a.lossKgPerHour ?? 0) || byTag(a.tag, b.tag));
  const counts = {
    traps: items.length,
    reviewed: items.filter((i) => i.state === 'confirmed' || i.state === 'overridden').length,
    retestPending: items.filter((i) => i.state === 'retest_pending').length,
    unreviewed: items.filter((i) => i.state === 'unreviewed').length,
  };
  return { items, counts };
}

// A queue of 20,000 traps is some 10 MB of objects: a few surveys at a time.
const queues = new DerivedCache<Awaited<ReturnType<typeof queueOf>>>(4);

/**
 * Every trap tested in a survey, worst first (suggested verdict severity, then estimated loss),
 * with where its review stands. The sorted queue over a survey's traps (20,000 of them) is kept
 * while the survey's data stands (lib/services/derived-cache.ts); each request filters and pages it.
 */
export async function reviewQueue(surveyId: number, f: QueueFilter) {
  const version = await surveyDataVersion(surveyId);
  const queue = await queues.get(`${surveyId}:${f.uploadId ?? ''}`, version, () => queueOf(surveyId, f.uploadId));
  let items = queue.items;
  if (f.areaId) items = items.filter((i) => i.areaId === f.areaId);
  if (f.trapType) items = items.filter((i) => i.trapType === f.trapType);
  if (f.verdict) items = items.filter((i) => (i.verdict ?? i.suggested) === f.verdict);
  if (f.reviewed === 'yes') items = items.filter((i) => i.state === 'confirmed' || i.state === 'overridden');
  if (f.reviewed === 'no') items = items.filter((i) => i.state === 'unreviewed');
  if (f.reviewed === 'retest') items = items.filter((i) => i.state === 'retest_pending');
  const page = items.slice((f.page - 1) * f.pageSize, f.page * f.pageSize);
  const deciders = [...new Set(page.map((i) => i.decidedById).filter((id): id is number => id !== null))];
  const names = new Map(deciders.length
    ? ((await User.findAll({ where: { id: { [Op.in]: deciders } }, attributes: ['id', 'name'], raw: true })) as { id: number; name: string }[]).map((u) => [u.id, u.name])
    : []);
  return {
    items: page.map(({ decidedById, decidedAt, ...i }) => ({ ...i, decidedBy: decidedById === null ? null : names.get(decidedById) ?? null, decidedAt })),
    total: items.length, page: f.page, pageSize: f.pageSize, counts: queue.counts,
  };
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

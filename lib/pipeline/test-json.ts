// The JSON form of one analysed test and of one problem: the command line's --json
// lines and, later, the API's. Documented in the README ("Command-line analyser").
// Stable: every key is always present (null when it does not apply), keys are only
// ever added, and numbers are rounded to what the meters resolve (0.0001 dB, 1 ms),
// so that float noise does not make two runs of the same file differ.

import type { TestAnalysis } from '@/lib/analysis/analyse-test';
import type { SuggestedVerdict } from '@/lib/analysis/verdict';
import { VERDICT_LABELS, type Confidence, type VerdictCode } from '@/lib/analysis/verdict-codes';
import type { AnalysedTest } from './analysed-test';
import type { PipelineProblem } from './problems';

export const TEST_JSON_VERSION = 1;

type Num = number | null;

export interface TestJson {
  file: string;
  entry: string | null;
  tag: string;
  role: 'trap' | 'reference';
  linkedTrapTag: string | null;
  startedAt: string;
  durationS: number;
  sampleCount: number;
  sampleRateHz: number;
  regularTimebase: boolean;
  lines: { first: number; last: number };
  profile: { name: string; source: 'given' | 'detected' };
  trap: { inRegister: boolean; type: string | null; pressureBarg: Num; sizeDn: Num; orificeMm: Num; status: string | null };
  level: { meanDb: Num; medianDb: Num; sdDb: Num; p10Db: Num; p90Db: Num; minDb: Num; maxDb: Num };
  bands: { quietMaxDb: Num; liveSteamMinDb: Num; quietShare: Num; condensateShare: Num; liveSteamShare: Num };
  temperature: {
    meanC: Num; medianC: Num; minC: Num; maxC: Num; readings: number;
    tsatC: Num; subcoolingK: Num; allowanceK: Num; cold: boolean | null; beyondAllowance: boolean | null;
  };
  cycles: {
    dutyCycle: Num; openIntervals: Num; closedIntervals: Num; cyclesPerMinute: Num; continuousFlow: boolean | null;
    meanOpenS: Num; meanClosedS: Num; meanCyclePeriodS: Num; meanClosedDb: Num; baselineMinDb: Num; baselineMaxDb: Num;
    /** [startS, endS] of each open interval, seconds from the test start. */
    openSpansS: Array<[number, number]>;
  };
  reference: {
    available: boolean; tag: string | null; file: string | null; entry: string | null; startedAt: string | null;
    meanDb: Num; differenceDb: Num; marginDb: Num; clearlyLouder: boolean | null;
    /** Reference tests: how many trap tests' checks it served. */
    servesTrapTests: number;
  };
  verdict: {
    suggested: VerdictCode | null; label: string | null; confidence: Confidence | null; row: number | null;
    failed: boolean | null; reasons: string[]; settled: boolean;
  };
  loss: {
    kgPerHour: Num; tonnesPerYear: Num; lossMode: string | null; severityFactor: Num; orificeMm: Num; orificeSource: string | null;
    dischargeCoefficient: Num; convention: string | null; operatingHoursPerYear: Num;
    co2TonnesPerYear: Num; costPerYear: Num; currency: string | null; note: string | null;
  };
  notes: string[];
}

export interface ProblemJson {
  problem: {
    code: string; severity: string; file: string; entry: string | null; line: number | null; column: number | null; message: string;
  };
}

function round(x: number | null | undefined, digits: number): Num {
  if (x === null || x === undefined || !Number.isFinite(x)) return null;
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
const db = (x: number | null | undefined) => round(x, 4);
const sec = (x: number | null | undefined) => round(x, 3);
const share = (x: number | null | undefined) => round(x, 4);

/** A reference test has no verdict of its own: the decision table is about traps. */
export function verdictOf(t: AnalysedTest): SuggestedVerdict | null {
  return t.role === 'trap' && t.analysis ? t.analysis.verdict : null;
}

function verdictJson(t: AnalysedTest): TestJson['verdict'] {
  const v = verdictOf(t);
  if (v) return { suggested: v.code, label: VERDICT_LABELS[v.code], confidence: v.confidence, row: v.row, failed: v.failed, reasons: v.reasons, settled: t.settled };
  if (t.role === 'trap') {
    // Not analysable (one reading with no rate): inconclusive, as row 9 of the table would say.
    return { suggested: 'inconclusive', label: VERDICT_LABELS.inconclusive, confidence: 'low', row: null, failed: false, reasons: [t.notAnalysed ?? 'not analysed'], settled: t.settled };
  }
  const served = t.servesTrapTests.length;
  const reason = t.linkedTrapTag
    ? `reference point on the adjacent pipe of ${t.linkedTrapTag}: no verdict of its own; its mean level serves the reference check of ${served} trap test${served === 1 ? '' : 's'}`
    : 'reference point linked to no trap: no verdict of its own';
  return { suggested: null, label: null, confidence: null, row: null, failed: null, reasons: [reason], settled: t.settled };
}

function lossJson(t: AnalysedTest, a: TestAnalysis | null): TestJson['loss'] {
  const l = t.role === 'trap' ? a?.loss ?? null : null;
  let note: string | null = null;
  if (!l) {
    const v = verdictOf(t);
    if (t.role === 'reference') note = 'no loss for a reference test';
    else if (a?.lossNote) note = a.lossNote;
    else if (v) note = `no steam loss for a ${VERDICT_LABELS[v.code]} verdict`;
    else note = 'not analysed';
  }
  return {
    kgPerHour: round(l?.kgPerHour, 3),
    tonnesPerYear: round(l?.tonnesPerYear, 3),
    lossMode: l?.lossMode ?? null,
    severityFactor: l?.severityFactor ?? null,
    orificeMm: l?.orificeMm ?? null,
    orificeSource: l?.orificeSource ?? null,
    dischargeCoefficient: l?.dischargeCoefficient ?? null,
    convention: l?.convention ?? null,
    operatingHoursPerYear: l?.operatingHoursPerYear ?? null,
    co2TonnesPerYear: round(l?.cost.co2TonnesPerYear, 3),
    costPerYear: round(l?.cost.costPerYear ?? null, 2),
    currency: l?.cost.currency ?? null,
    note,
  };
}

export function testJson(t: AnalysedTest): TestJson {
  const a = t.analysis;
  const c = a?.cycles;
  const temp = a?.temperature;
  const ref = a?.reference;
  return {
    file: t.file,
    entry: t.entry,
    tag: t.tag,
    role: t.role,
    linkedTrapTag: t.linkedTrapTag,
    startedAt: new Date(t.startedAt).toISOString(),
    durationS: sec(t.durationS)!,
    sampleCount: t.sampleCount,
    sampleRateHz: round(t.sampleRateHz, 6)!,
    regularTimebase: t.regular,
    lines: { first: t.firstLine, last: t.lastLine },
    profile: { name: t.profile.name, source: t.profile.source },
    trap: {
      inRegister: t.trap.inRegister,
      type: t.trap.facts.type,
      pressureBarg: t.trap.facts.pressureBarg,
      sizeDn: t.trap.facts.sizeDn,
      orificeMm: t.trap.facts.orificeMm,
      status: t.trap.status,
    },
    level: {
      meanDb: db(t.level.mean), medianDb: db(t.level.median), sdDb: db(t.level.sd), p10Db: db(t.level.p10), p90Db: db(t.level.p90),
      minDb: db(t.level.min), maxDb: db(t.level.max),
    },
    bands: {
      quietMaxDb: a?.bands.quietMaxDb ?? null, liveSteamMinDb: a?.bands.liveSteamMinDb ?? null,
      quietShare: share(a?.bands.shares.quiet), condensateShare: share(a?.bands.shares.condensate), liveSteamShare: share(a?.bands.shares.liveSteam),
    },
    temperature: {
      meanC: round(t.temperature?.meanC, 2), medianC: round(t.temperature?.medianC, 2), minC: round(t.temperature?.minC, 2), maxC: round(t.temperature?.maxC, 2),
      readings: t.temperature?.count ?? 0,
      tsatC: round(temp?.tsatC, 2), subcoolingK: round(temp?.subcoolingK, 2), allowanceK: temp?.allowanceK ?? null,
      cold: temp?.cold ?? null, beyondAllowance: temp?.beyondAllowance ?? null,
    },
    cycles: {
      dutyCycle: share(c?.dutyCycle),
      openIntervals: c ? (c.continuousFlow ? 1 : c.openIntervals.length) : null,
      closedIntervals: c ? c.closedIntervals.length : null,
      cyclesPerMinute: round(c?.cyclesPerMinute, 3),
      continuousFlow: c?.continuousFlow ?? null,
      meanOpenS: sec(c?.meanOpenS), meanClosedS: sec(c?.meanClosedS), meanCyclePeriodS: sec(c?.meanCyclePeriodS),
      meanClosedDb: db(c?.meanClosedDb), baselineMinDb: db(c?.baselineDb.min), baselineMaxDb: db(c?.baselineDb.max),
      openSpansS: c ? c.openIntervals.map((iv) => [sec(iv.startS)!, sec(iv.endS)!]) : [],
    },
    reference: {
      available: t.role === 'trap' ? (ref?.available ?? false) : false,
      tag: t.reference?.tag ?? null,
      file: t.reference?.file ?? null,
      entry: t.reference?.entry ?? null,
      startedAt: t.reference ? new Date(t.reference.startedAt).toISOString() : null,
      meanDb: db(t.reference?.meanDb),
      differenceDb: t.role === 'trap' ? db(ref?.differenceDb) : null,
      marginDb: a?.params.reference.marginDb ?? null,
      clearlyLouder: t.role === 'trap' ? (ref?.clearlyLouder ?? null) : null,
      servesTrapTests: t.servesTrapTests.length,
    },
    verdict: verdictJson(t),
    loss: lossJson(t, a),
    notes: t.notes,
  };
}

export function problemJson(p: PipelineProblem): ProblemJson {
  return {
    problem: { code: p.code, severity: p.severity, file: p.file, entry: p.entry ?? null, line: p.line ?? null, column: p.column ?? null, message: p.message },
  };
}

/**
 * The --json lines of a run, in input order: each input's own problems (a zip's), then
 * for each of its files the file's problems and its tests.
 */
export function runJsonLines(run: { inputs: Array<{ problems: PipelineProblem[]; files: Array<{ file: string; entry: string | null; problems: PipelineProblem[] }> }>; tests: AnalysedTest[] }): Array<TestJson | ProblemJson> {
  const byFile = new Map<string, AnalysedTest[]>();
  for (const t of run.tests) {
    const k = `${t.file}\u0000${t.entry ?? ''}`;
    const list = byFile.get(k);
    if (list) list.push(t);
    else byFile.set(k, [t]);
  }
  const out: Array<TestJson | ProblemJson> = [];
  for (const input of run.inputs) {
    out.push(...input.problems.map(problemJson));
    for (const f of input.files) {
      out.push(...f.problems.map(problemJson));
      out.push(...(byFile.get(`${f.file}\u0000${f.entry ?? ''}`) ?? []).map(testJson));
    }
  }
  return out;
}

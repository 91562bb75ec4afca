// One analysed test: where it came from, what it is, and its figures — without its
// series. This is what a caller keeps while files stream past (a few kilobytes a
// test), so that verdicts can be settled once the reference tests of the run are known
// (./settle.ts) without reading or analysing any series again.

import { analyseTest, type TestAnalysis } from '@/lib/analysis/analyse-test';
import { NO_OVERRIDES, type ParamOverrides } from '@/lib/analysis/defaults';
import { computeLevelStatistics, type LevelStatistics } from '@/lib/analysis/level-statistics';
import { summariseTemperature, type TemperatureSummary } from '@/lib/analysis/temperature';
import type { ReferenceLink } from '@/lib/import/instrument-profile';
import type { NormalisedTest, PointRole } from '@/lib/import/normalised-test';
import { makeProblem, type PipelineProblem } from './problems';
import { toTestInput } from './test-input';
import { lookUpTrap, type TrapLookup, type TrapRegister } from './trap-register';

export interface ProfileUsed {
  name: string;
  /** 'given': a profile the caller passed; 'detected': the layout detection's suggestion. */
  source: 'given' | 'detected';
  /** Files of one layout share this: the profile's header fingerprint, else its name. */
  layout: string;
  referenceLink: ReferenceLink;
}

/** For a trap test: the reference test its reference check used. */
export interface ReferenceUsed {
  key: string;
  tag: string;
  file: string;
  entry: string | null;
  startedAt: number;
  meanDb: number;
}

export interface AnalysedTest {
  /** Unique within a run: file, entry and first line. */
  key: string;
  file: string;
  entry: string | null;
  hints: string[];
  tag: string;
  role: PointRole;
  /** For a reference test, the trap it belongs to (from the profile's link rule, or linked across files). */
  linkedTrapTag: string | null;
  /** UTC milliseconds of the first reading. */
  startedAt: number;
  durationS: number;
  sampleCount: number;
  sampleRateHz: number;
  regular: boolean;
  firstLine: number;
  lastLine: number;
  profile: ProfileUsed;
  /** The register's entry for the trap (for a reference test: for its linked trap). */
  trap: TrapLookup;
  /** Null when the test could not be analysed (see notAnalysed). */
  analysis: TestAnalysis | null;
  /** Why there is no analysis; null when there is one. */
  notAnalysed: string | null;
  /** Level and temperature summaries, present even when the rest could not be analysed. */
  level: LevelStatistics;
  temperature: TemperatureSummary | null;
  /** Trap tests: the reference test used, once settled; null when none was found. */
  reference: ReferenceUsed | null;
  /** Reference tests: keys of the trap tests whose reference check it served. */
  servesTrapTests: string[];
  /** False until ./settle.ts has paired references; the verdict may still change. */
  settled: boolean;
  notes: string[];
}

export interface MeasureContext {
  register?: TrapRegister | null;
  params?: ParamOverrides;
  profile: ProfileUsed;
}

export function testKey(file: string, entry: string | null | undefined, firstLine: number): string {
  return `${file}\u0000${entry ?? ''}\u0000${firstLine}`;
}

/**
 * The expensive part, run once per test as it streams out of the reader: every figure
 * that depends on the series. The reference check is left for ./settle.ts; until then
 * the verdict is the one without a reference reading.
 */
export function measureTest(test: NormalisedTest, ctx: MeasureContext): { analysed: AnalysedTest; problem: PipelineProblem | null } {
  const trapTag = test.role === 'trap' ? test.tag : test.linkedTrapTag;
  const trap = lookUpTrap(ctx.register, trapTag);
  const input = toTestInput(test, trap.facts);
  let analysis: TestAnalysis | null = null;
  let notAnalysed: string | null = null;
  let problem: PipelineProblem | null = null;
  if (input.ok) analysis = analyseTest(input.input, ctx.params ?? NO_OVERRIDES);
  else {
    notAnalysed = input.reason;
    problem = makeProblem({ file: test.source.file, entry: test.source.entry }, 'test-not-analysed', 'warning', `the test of ${test.tag} is not analysed: ${input.reason}`, {
      line: test.source.firstLine,
      expected: 'a series of readings with a known sample rate',
    });
  }
  const analysed: AnalysedTest = {
    key: testKey(test.source.file, test.source.entry, test.source.firstLine),
    file: test.source.file,
    entry: test.source.entry ?? null,
    hints: test.source.hints,
    tag: test.tag,
    role: test.role,
    linkedTrapTag: test.linkedTrapTag,
    startedAt: test.startedAt,
    durationS: test.durationS,
    sampleCount: test.sampleCount,
    sampleRateHz: test.sampleRateHz,
    regular: test.timeOffsetsS === null,
    firstLine: test.source.firstLine,
    lastLine: test.source.lastLine,
    profile: ctx.profile,
    trap,
    analysis,
    notAnalysed,
    level: analysis ? analysis.level : computeLevelStatistics(test.levelDb),
    temperature: analysis ? analysis.temperature.summary : summariseTemperature(test.temperatureC),
    reference: null,
    servesTrapTests: [],
    settled: false,
    notes: [...trap.notes],
  };
  return { analysed, problem };
}

// Settling: the cheap second half of a test's analysis, once the run's reference tests
// are known. The series-dependent figures (statistics, intervals, bands, temperature)
// were computed by analyseTest as the test streamed past; the reference check, the
// verdict that depends on it (decision-table row 3) and the steam loss that depends on
// the verdict are computed here from those figures. The result equals analyseTest run
// with the reference mean in the first place (tests/lib/pipeline/settle.test.ts checks
// that on every fixture and on synthetic tests, so the two cannot drift apart).

import { judgeTest, type TestAnalysis, type TrapFacts } from '@/lib/analysis/analyse-test';
import type { AnalysedTest } from './analysed-test';
import { pairReferences } from './pair-references';

/** The analysis with its reference check, verdict and loss recomputed for this reference reading. */
export function settleAnalysis(
  analysis: TestAnalysis,
  trap: TrapFacts,
  referenceMeanDb: number | null,
  lineOutOfServiceNote = false,
): TestAnalysis {
  const judged = judgeTest(
    { meanDb: analysis.level.mean, cycles: analysis.cycles, bands: analysis.bands, shares: analysis.bands.shares, temperature: analysis.temperature },
    trap, referenceMeanDb, lineOutOfServiceNote, analysis.params,
  );
  return { ...analysis, ...judged };
}

export interface SettleOptions {
  /** A field note says the line of this trap tag is out of service (the server's field notes). */
  lineOutOfService?: (trapTag: string) => boolean;
}

/**
 * Pairs references across all the given tests (one run) and settles every verdict.
 * Returns new records in the same order; the inputs are not changed. Idempotent: a
 * run can be settled again when more files arrive.
 */
export function settleTests(tests: readonly AnalysedTest[], opts: SettleOptions = {}): AnalysedTest[] {
  const { referenceOf, linkedAcrossFiles } = pairReferences(tests);
  const byKey = new Map(tests.map((t) => [t.key, t]));
  const serves = new Map<string, string[]>();
  for (const [trapKey, refKey] of referenceOf) {
    const list = serves.get(refKey);
    if (list) list.push(trapKey);
    else serves.set(refKey, [trapKey]);
  }
  return tests.map((t) => {
    const out: AnalysedTest = { ...t, settled: true, notes: [...t.notes], servesTrapTests: [], reference: null };
    if (t.role === 'reference') {
      const across = linkedAcrossFiles.get(t.key);
      if (across && t.linkedTrapTag === null) {
        out.linkedTrapTag = across;
        out.notes.push(`linked across files to the trap test of ${across} right before it`);
      }
      out.servesTrapTests = serves.get(t.key) ?? [];
      if (out.linkedTrapTag === null) out.notes.push('a reference test linked to no trap: it serves no reference check');
      return out;
    }
    const ref = referenceOf.has(t.key) ? byKey.get(referenceOf.get(t.key)!)! : null;
    if (ref) {
      out.reference = { key: ref.key, tag: ref.tag, file: ref.file, entry: ref.entry, startedAt: ref.startedAt, meanDb: ref.level.mean };
    }
    if (t.analysis) {
      out.analysis = settleAnalysis(t.analysis, t.trap.facts, ref ? ref.level.mean : null, opts.lineOutOfService?.(t.tag) ?? false);
    }
    return out;
  });
}

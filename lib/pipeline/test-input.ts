// From a normalised test (lib/import) to the input of analyseTest (lib/analysis).
// The reader stores a regular series as a rate alone (timeOffsetsS null) and an
// irregular one as offsets with a nominal rate; the analysis wants a Timebase. A test of
// one reading whose rate is unknown (rate 0: nothing says how long the reading lasted)
// has no timebase, and is reported rather than analysed with an invented rate.

import type { TestInput, TrapFacts } from '@/lib/analysis/analyse-test';
import { irregularTimebase, regularTimebase, type Timebase } from '@/lib/analysis/timebase';
import type { NormalisedTest } from '@/lib/import/normalised-test';

export type TimebaseResult = { ok: true; timebase: Timebase } | { ok: false; reason: string };

export function timebaseOf(test: NormalisedTest): TimebaseResult {
  if (test.timeOffsetsS) {
    if (test.timeOffsetsS.length >= 2) return { ok: true, timebase: irregularTimebase(test.timeOffsetsS) };
    return { ok: false, reason: 'an irregular series of fewer than two readings has no time scale' };
  }
  if (test.sampleRateHz > 0 && Number.isFinite(test.sampleRateHz)) return { ok: true, timebase: regularTimebase(test.sampleRateHz) };
  return {
    ok: false,
    reason: test.sampleCount === 1 ? 'a single reading with no sample rate: its duration is unknown, so it cannot be analysed; re-test' : 'the sample rate is unknown',
  };
}

export type TestInputResult = { ok: true; input: TestInput } | { ok: false; reason: string };

export function toTestInput(
  test: NormalisedTest,
  trap: TrapFacts,
  extra: { referenceMeanDb?: number | null; lineOutOfServiceNote?: boolean } = {},
): TestInputResult {
  const tb = timebaseOf(test);
  if (!tb.ok) return tb;
  return {
    ok: true,
    input: {
      timebase: tb.timebase,
      levelDb: test.levelDb,
      temperatureC: test.temperatureC,
      trap,
      referenceMeanDb: extra.referenceMeanDb ?? null,
      lineOutOfServiceNote: extra.lineOutOfServiceNote ?? false,
    },
  };
}

import { describe, expect, it } from 'vitest';
import { analyseTest, type TrapFacts } from '@/lib/analysis/analyse-test';
import { regularTimebase } from '@/lib/analysis/timebase';
import { readTests } from '@/lib/import/read-tests';
import { settleAnalysis } from '@/lib/pipeline/settle';
import { toTestInput } from '@/lib/pipeline/test-input';
import { makeSignal, periodicOpenings } from '../analysis/synthetic-signal';
import { loadProfile, METER_FIXTURES } from './fixture-files';

/**
 * Settling must give exactly what analyseTest gives when it is told the reference mean
 * from the start: the pipeline analyses a test once, as it streams past, and settles the
 * reference check later. If analyseTest's wiring of reference, verdict or loss changes,
 * these fail.
 */

const TRAPS: TrapFacts[] = [
  { type: null, pressureBarg: null, sizeDn: null, orificeMm: null, outOfService: false },
  { type: 'thermodynamic_disc', pressureBarg: 8, sizeDn: 15, orificeMm: null, outOfService: false },
  { type: 'inverted_bucket', pressureBarg: 6, sizeDn: 25, orificeMm: 5, outOfService: false },
  { type: 'thermostatic_bimetallic', pressureBarg: 4, sizeDn: 20, orificeMm: null, outOfService: false },
  { type: 'float_thermostatic', pressureBarg: 10, sizeDn: 50, orificeMm: null, outOfService: true },
];
const REFERENCES = [null, 10, 25, 40, 75];

const fixtureTests = METER_FIXTURES.flatMap(({ fileName, expected, bytes }) =>
  readTests(bytes, loadProfile(expected.profile), { fileName, timeZone: expected.timeZone }).tests.filter((t) => t.role === 'trap'),
);

describe('settleAnalysis equals analyseTest with the reference known from the start', () => {
  it.each(fixtureTests.map((t) => [`${t.source.file} ${t.tag} line ${t.source.firstLine}`, t] as const))('%s', (_name, test) => {
    for (const trap of TRAPS) {
      const once = toTestInput(test, trap);
      if (!once.ok) throw new Error(once.reason);
      const provisional = analyseTest(once.input);
      for (const ref of REFERENCES) {
        const direct = analyseTest({ ...once.input, referenceMeanDb: ref });
        expect(settleAnalysis(provisional, trap, ref)).toEqual(direct);
      }
    }
  });

  it('including the rows the reference check decides (background noise), and a field note', () => {
    const s = makeSignal({ rateHz: 20, durationS: 40, openings: periodicOpenings(1, 8, 1.5, 40), closedDb: 34, openDb: 60, noiseDb: 0.5, seed: 3 });
    const input = { timebase: regularTimebase(20), levelDb: s.level, temperatureC: new Float32Array(s.level.length).fill(170), trap: TRAPS[1] };
    const provisional = analyseTest(input);
    expect(provisional.verdict.code).toBe('leaking');
    const noisyPipe = settleAnalysis(provisional, TRAPS[1], provisional.level.mean - 2);
    expect(noisyPipe.verdict.code).toBe('background_noise');
    expect(noisyPipe.loss).toBeNull();
    expect(noisyPipe).toEqual(analyseTest({ ...input, referenceMeanDb: provisional.level.mean - 2 }));
    const noted = settleAnalysis(provisional, TRAPS[1], null, true);
    expect(noted.verdict.code).toBe('out_of_service');
    expect(noted).toEqual(analyseTest({ ...input, lineOutOfServiceNote: true }));
  });
});

import { describe, expect, it } from 'vitest';
import { analyseTest } from '@/lib/analysis/analyse-test';
import { regularTimebase } from '@/lib/analysis/timebase';
import { makeSignal, periodicOpenings } from './synthetic-signal';

// The reasons are read by people: the article follows the trap type's first sound
// ("an inverted bucket trap", "a thermodynamic disc trap"). Found by the command line's
// table, which printed "a inverted bucket trap cycles".
describe('verdict reasons name the trap type with the right article', () => {
  const s = makeSignal({ rateHz: 10, durationS: 40, openings: periodicOpenings(1, 8, 1.5, 40), closedDb: 18, openDb: 60, noiseDb: 0.3, seed: 5 });
  it.each([
    ['inverted_bucket', 'an inverted bucket trap cycles: open, then shut tight'],
    ['thermodynamic_disc', 'a thermodynamic disc trap cycles: open, then shut tight'],
  ] as const)('%s', (type, reason) => {
    const a = analyseTest({ timebase: regularTimebase(10), levelDb: s.level, temperatureC: new Float32Array(s.level.length).fill(160), trap: { type, pressureBarg: 5 } });
    expect(a.verdict.code).toBe('working');
    expect(a.verdict.reasons).toContain(reason);
  });
});

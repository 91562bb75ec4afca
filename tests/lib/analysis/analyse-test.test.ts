// The entry point: what it returns, that a re-run with the returned parameters
// reproduces it, input checks, and speed (issue 7: the per-test analysis within
// ~10 % of import time — 2 M readings in well under ~150 ms).
import { describe, expect, it } from 'vitest';
import { analyseTest, type TestInput } from '@/lib/analysis/analyse-test';
import { irregularTimebase, regularTimebase } from '@/lib/analysis/timebase';
import { makeSignal, periodicOpenings, seededRandom } from './synthetic-signal';

function leakingDisc(): TestInput {
  const { level } = makeSignal({
    rateHz: 10,
    durationS: 40,
    openings: periodicOpenings(3, 10, 1.2, 40),
    closedDb: 34,
    openDb: 62,
    noiseDb: 0.5,
  });
  return {
    timebase: regularTimebase(10),
    levelDb: level,
    temperatureC: new Float32Array(level.length).fill(176),
    trap: { type: 'thermodynamic_disc', pressureBarg: 10, sizeDn: 20 },
    referenceMeanDb: 20,
  };
}

describe('analyseTest', () => {
  it('returns every part, with the parameters it used', () => {
    const r = analyseTest(leakingDisc(), { cost: { steamPricePerTonne: 35, currency: 'EUR' } });
    expect(r.level.count).toBe(400);
    expect(r.cycles.openIntervals).toHaveLength(4);
    expect(r.bands.shares.quiet + r.bands.shares.condensate + r.bands.shares.liveSteam).toBeCloseTo(1, 12);
    expect(r.temperature.tsatC!).toBeCloseTo(184.12, 2);
    expect(r.temperature.summary?.medianC).toBe(176);
    expect(r.reference.clearlyLouder).toBe(true);
    expect(r.verdict.code).toBe('leaking');
    expect(r.loss).not.toBeNull();
    expect(r.loss!.orificeMm).toBe(4.8); // DN20 default
    expect(r.loss!.orificeSource).toBe('default_by_size');
    expect(r.loss!.cost.costPerYear!).toBeCloseTo(r.loss!.tonnesPerYear * 35, 9);
    expect(r.params.cost.steamPricePerTonne).toBe(35);
  });

  it('a re-run with the returned parameters gives the same result', () => {
    const first = analyseTest(leakingDisc(), { intervals: { openAboveBaselineDb: 9 }, reference: { marginDb: 5 } });
    const stored = JSON.parse(JSON.stringify(first.params));
    expect(analyseTest(leakingDisc(), stored)).toEqual(first);
  });

  it('accepts plain arrays and irregular times', () => {
    const r = analyseTest({ timebase: irregularTimebase(Float64Array.from([0, 0.5, 1.1, 1.5])), levelDb: [10, 11, 10, 12] });
    expect(r.cycles.testDurationS).toBeCloseTo(0.25 + 1.5 + 0.2, 12);
    expect(r.verdict.code).toBe('inconclusive');
  });

  it('degenerate but valid tests: one reading, and a constant level', () => {
    const one = analyseTest({ timebase: regularTimebase(2), levelDb: [14] });
    expect(one.cycles.testDurationS).toBe(0.5);
    expect(one.cycles.closedIntervals).toHaveLength(1);
    const flat = analyseTest({ timebase: regularTimebase(50), levelDb: new Float32Array(100_000).fill(18) });
    expect(flat.level).toMatchObject({ median: 18, p10: 18, sd: 0, lag1Autocorrelation: null });
    expect(flat.cycles.dutyCycle).toBe(0);
  });

  it('refuses bad input cleanly', () => {
    expect(() => analyseTest({ timebase: regularTimebase(10), levelDb: [] })).toThrow(RangeError);
    expect(() => analyseTest({ timebase: regularTimebase(0), levelDb: [1, 2] })).toThrow(RangeError);
    expect(() => analyseTest({ timebase: irregularTimebase(Float64Array.from([0, 1, 1])), levelDb: [1, 2, 3] })).toThrow(/increase/);
    expect(() => analyseTest({ timebase: regularTimebase(10), levelDb: [1, Number.NaN] })).toThrow(/not a finite/);
  });
});

describe('a long record', () => {
  // A day's worth of readings in one test: 2 M readings at 50 Hz, a disc trap cycling
  // every ~9 s with a slow drift and noise, and a temperature column.
  function bigTest(): TestInput {
    const n = 2_000_000;
    const rate = 50;
    const level = new Float32Array(n);
    const temperature = new Float32Array(n);
    const random = seededRandom(42);
    for (let i = 0; i < n; i++) {
      const t = i / rate;
      const open = t % 9.1 < 1.1;
      level[i] = (open ? 60 : 16) + 3 * Math.sin(t / 600) + (random() - 0.5) * 2;
      temperature[i] = 175 + random();
    }
    return { timebase: regularTimebase(rate), levelDb: level, temperatureC: temperature, trap: { type: 'thermodynamic_disc', pressureBarg: 10 } };
  }

  // Its speed is measured by `npm run bench:analysis` (ns per sample), not by a timed test.
  it('reads 2 M readings whole: every open interval of a long cycling record', () => {
    const result = analyseTest(bigTest());
    expect(result.cycles.openIntervals.length).toBe(Math.ceil(40_000 / 9.1));
    expect(result.verdict.code).toBe('working');
  });
});

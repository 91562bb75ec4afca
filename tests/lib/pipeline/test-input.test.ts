import { describe, expect, it } from 'vitest';
import { analyseTest } from '@/lib/analysis/analyse-test';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import { timebaseOf, toTestInput } from '@/lib/pipeline/test-input';

function test(partial: Partial<NormalisedTest>): NormalisedTest {
  const n = partial.levelDb?.length ?? 4;
  return {
    tag: 'SM-TRC-200', role: 'trap', linkedTrapTag: null, startedAt: Date.UTC(2025, 3, 9, 8), sampleRateHz: 10, timeOffsetsS: null,
    sampleCount: n, durationS: (n - 1) / 10, levelDb: new Float32Array(n).fill(20), temperatureC: null,
    source: { file: 'x.csv', hints: [], firstLine: 2, lastLine: n + 1 }, duplicatesCollapsed: 0, backwardsJumps: 0,
    ...partial,
  };
}
const unknownTrap = { type: null, pressureBarg: null, sizeDn: null, orificeMm: null, outOfService: false };

describe('toTestInput', () => {
  it('gives a regular timebase at the reader’s rate when the series has no offsets', () => {
    expect(timebaseOf(test({ sampleRateHz: 20 }))).toEqual({ ok: true, timebase: { kind: 'regular', rateHz: 20, startS: 0 } });
  });

  it('gives the offsets themselves for an irregular series', () => {
    const offsets = Float64Array.from([0, 0.1, 0.25, 0.3]);
    const r = timebaseOf(test({ timeOffsetsS: offsets, sampleRateHz: 10 }));
    expect(r).toEqual({ ok: true, timebase: { kind: 'irregular', offsetsS: offsets } });
  });

  it('reports a one-reading test with no rate instead of analysing it with an invented one', () => {
    const t = test({ levelDb: Float32Array.from([41]), sampleCount: 1, sampleRateHz: 0, durationS: 0 });
    const r = toTestInput(t, unknownTrap);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/single reading with no sample rate/);
  });

  it('feeds analyseTest: the level, the temperature, the trap and the reference mean pass through', () => {
    const level = Float32Array.from({ length: 200 }, (_, i) => (i % 50 < 10 ? 60 : 18));
    const temperature = new Float32Array(200).fill(150);
    const trap = { type: 'thermodynamic_disc' as const, pressureBarg: 5, sizeDn: 15, orificeMm: null, outOfService: false };
    const r = toTestInput(test({ levelDb: level, temperatureC: temperature }), trap, { referenceMeanDb: 17 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.input.levelDb).toBe(level);
    expect(r.input.temperatureC).toBe(temperature);
    const a = analyseTest(r.input);
    expect(a.level.count).toBe(200);
    expect(a.temperature.tsatC).toBeCloseTo(158.8, 0); // IF97 at 6.013 bar abs ≈ 158.8 °C (the steam tables in shared/references)
    expect(a.reference.referenceMeanDb).toBe(17);
  });
});

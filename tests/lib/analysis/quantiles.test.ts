// The fast percentile path must give exactly what simple-statistics' quantile gives
// (linear interpolation between order statistics, R type 7) — it only avoids copying
// and partitioning two million readings.
import { describe, expect, it } from 'vitest';
import { quantile } from 'simple-statistics';
import { quantileOfRange, quantiles } from '@/lib/analysis/quantiles';
import { summariseTemperature } from '@/lib/analysis/temperature';
import { seededRandom } from './synthetic-signal';

const PS = [0, 0.1, 0.25, 0.5, 0.9, 0.999, 1];

function series(n: number, make: (random: () => number, i: number) => number, seed = 1): Float32Array {
  const random = seededRandom(seed);
  const out = new Float32Array(n);
  for (let i = 0; i < n; i++) out[i] = make(random, i);
  return out;
}

describe('quantiles', () => {
  it.each([
    ['noisy two-level level series', series(300_001, (r, i) => (i % 450 < 50 ? 60 : 16) + (r() - 0.5) * 2)],
    ['readings quantised to 0.1 dB', series(200_000, (r) => Math.round((20 + r() * 30) * 10) / 10)],
    ['mostly one value with a few outliers', series(100_000, (r, i) => (i % 997 === 0 ? 90 + r() : 12))],
    ['heavy tail', series(150_000, (r) => -Math.log(Math.max(r(), 1e-9)) * 5)],
  ])('%s: identical to simple-statistics', (_name, x) => {
    const expected = quantile(Array.from(x), PS);
    expect(quantiles(x, PS)).toEqual(expected);
  });

  it('a constant long series', () => {
    expect(quantiles(new Float32Array(100_000).fill(7.5), [0.1, 0.9])).toEqual([7.5, 7.5]);
  });

  it('short series go straight to simple-statistics', () => {
    expect(quantiles([3, 1, 2, 4], [0.5])).toEqual([2.5]);
  });

  it('quantile of a range with a scratch buffer equals simple-statistics on that slice', () => {
    const x = series(5000, (r) => r() * 40);
    const scratch = new Float64Array(1000);
    for (const [s, e] of [[0, 250], [1234, 1987], [4999, 5000]] as const) {
      expect(quantileOfRange(x, s, e, 0.1, scratch)).toBe(quantile(Array.from(x.subarray(s, e)), 0.1));
    }
  });
});

describe('temperature summary', () => {
  it('skips gaps in the temperature column', () => {
    const s = summariseTemperature([170, Number.NaN, 172, 174, Number.POSITIVE_INFINITY, 180]);
    expect(s).toEqual({ count: 4, meanC: 174, medianC: 173, minC: 170, maxC: 180 });
  });
  it('no finite reading: no summary', () => {
    expect(summariseTemperature([Number.NaN, Number.NaN])).toBeNull();
    expect(summariseTemperature(null)).toBeNull();
  });
  it('a long column: exact mean, min and max; median from an even subsample within the spread', () => {
    const x = series(2_000_000, (r) => 175 + r());
    const s = summariseTemperature(x)!;
    expect(s.count).toBe(2_000_000);
    expect(Math.abs(s.medianC - 175.5)).toBeLessThan(0.02);
    expect(s.minC).toBeGreaterThanOrEqual(175);
    expect(s.maxC).toBeLessThanOrEqual(176); // float32 rounds 175.99999… up to 176
  });
});

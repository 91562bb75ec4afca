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

  it.each([
    ['a test of 4,000 readings quantised to 0.1 dB', series(4000, (r, i) => Math.round(((i % 300 < 40 ? 62 : 18) + r() * 3) * 10) / 10, 2)],
    ['a test of 4,000 readings of whole degrees', series(4000, (r) => Math.round(150 + r() * 6), 3)],
    ['a short test of 300 readings', series(300, (r) => r() * 50, 4)],
    // Bins of one value answer without gathering; here the top quantiles' bins hold several.
    ['whole decibels, with a tail of unrounded readings', series(4000, (r, i) => (i % 10 === 0 ? 60 + r() * 30 : Math.round(15 + r() * 8)), 10)],
  ])('%s: identical to simple-statistics, call after call', (_name, x) => {
    const expected = quantile(Array.from(x), PS);
    // The histogram and gathered readings are kept between calls: a call in between must leave nothing behind.
    quantiles(series(100_000, (r) => r() * 1000, 5), PS);
    expect(quantiles(x, PS)).toEqual(expected);
    expect(quantiles(x, PS)).toEqual(expected);
  });

  it('a needed bin larger than the buffer kept between calls (two values, 2.2 M readings)', () => {
    const x = series(2_200_000, (r) => (r() < 0.5 ? 10 : 20), 6);
    expect(quantiles(x, [0.25, 0.5, 0.75])).toEqual(quantile(Array.from(x), [0.25, 0.5, 0.75]));
    // …and the kept buffer still serves a test-sized call afterwards.
    const y = series(4000, (r) => Math.round(r() * 30), 7);
    expect(quantiles(y, PS)).toEqual(quantile(Array.from(y), PS));
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

  it('quantile of a range: low quantiles from the kept smallest readings, others by selection, all as simple-statistics', () => {
    // Quantised, with runs of equal readings: a rolling floor's 5 s blocks at 10 Hz are 50 readings.
    const x = series(3000, (r, i) => Math.round((i % 90 < 12 ? 55 : 20 + r() * 4) * 2) / 2, 8);
    const scratch = new Float64Array(400);
    for (const p of [0, 0.05, 0.1, 0.2, 0.25, 0.5, 0.9, 1]) {
      for (const [s, e] of [[0, 50], [50, 100], [7, 11], [100, 104], [200, 207], [500, 900], [2999, 3000]] as const) {
        expect(quantileOfRange(x, s, e, p, scratch), `p ${p}, [${s}, ${e})`).toBe(quantile(Array.from(x.subarray(s, e)), p));
      }
    }
  });
});

describe('temperature summary', () => {
  it('skips gaps in the temperature column', () => {
    const s = summariseTemperature([170, Number.NaN, 172, 174, Number.POSITIVE_INFINITY, 180]);
    expect(s).toEqual({ count: 4, meanC: 174, medianC: 173, minC: 170, maxC: 180 });
  });
  it('a float32 column with gaps: the median of its finite readings', () => {
    const x = series(5000, (r, i) => (i % 97 === 0 ? Number.NaN : Math.round((150 + r() * 5) * 10) / 10), 9);
    const finite = Array.from(x).filter(Number.isFinite);
    expect(summariseTemperature(x)!.medianC).toBe(quantile(finite, 0.5));
  });
  it('a list of numbers keeps its own precision', () => {
    expect(summariseTemperature([170.1, Number.NaN, 172.3, 174.7])!.medianC).toBe(172.3);
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

// Level statistics against NIST StRD, Univariate Summary Statistics
// (https://www.itl.nist.gov/div898/strd/univ/, copies in fixtures/nist/ with their
// provenance header). Certified values are read from each file.
import { describe, expect, it } from 'vitest';
import { quantile, sampleStandardDeviation } from 'simple-statistics';
import { computeLevelStatistics } from '@/lib/analysis/level-statistics';
import { logRelativeError, readNistDataset } from './nist-fixtures';

// Exact value of a binary64 number as numerator over 2^1074.
function exact(x: number): bigint {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const sign = bits >> 63n ? -1n : 1n;
  const exponent = Number((bits >> 52n) & 0x7ffn);
  const fraction = bits & ((1n << 52n) - 1n);
  const mantissa = exponent === 0 ? fraction : fraction | (1n << 52n);
  const shift = (exponent === 0 ? 1 : exponent) - 1075 + 1074;
  return sign * (mantissa << BigInt(shift));
}

function ratio(num: bigint, den: bigint): number {
  const negative = num < 0n !== den < 0n;
  const n = num < 0n ? -num : num;
  const d = den < 0n ? -den : den;
  const shift = Math.max(0, d.toString(2).length - n.toString(2).length + 80);
  const q = (n << BigInt(shift)) / d;
  return (negative ? -1 : 1) * Number(q) / 2 ** shift;
}

// Mean, sd and r(1) of the binary64 inputs computed in exact rational arithmetic:
// the best any binary64 program can be asked to reproduce.
function exactStatistics(values: number[]) {
  const n = BigInt(values.length);
  const xs = values.map(exact);
  const sum = xs.reduce((a, b) => a + b, 0n);
  const dev = xs.map((x) => n * x - sum); // n·(x − mean), scaled by 2^1074
  const sumSq = dev.reduce((a, d) => a + d * d, 0n);
  let sumLag = 0n;
  for (let i = 1; i < dev.length; i++) sumLag += dev[i] * dev[i - 1];
  const scale = 1n << 1074n;
  return {
    mean: ratio(sum, n * scale),
    sd: Math.sqrt(ratio(sumSq, n * n * scale * scale * (n - 1n))),
    lag1: ratio(sumLag, sumSq),
  };
}

const DATASETS = ['NumAcc1', 'NumAcc2', 'NumAcc3', 'Michelso', 'Lew'] as const;

// Minimum correct significant digits against the certified values. Where a
// dataset's decimals are not representable in binary64 (NumAcc3's 1000000.1 is
// off by ~6e-11, i.e. 6e-10 of the 0.1 spread), no binary64 program can do better
// than the exact value of its inputs; the second test pins that down.
const MIN_DIGITS: Record<(typeof DATASETS)[number], { mean: number; sd: number; lag1: number }> = {
  NumAcc1: { mean: 15, sd: 15, lag1: 15 },
  NumAcc2: { mean: 15, sd: 14, lag1: 14 },
  NumAcc3: { mean: 15, sd: 9.4, lag1: 12 },
  Michelso: { mean: 15, sd: 13.5, lag1: 13 },
  Lew: { mean: 15, sd: 14.5, lag1: 14.5 },
};

describe('level statistics: NIST StRD univariate datasets', () => {
  it.each(DATASETS)('%s: count, mean, sd (n−1) and lag-1 r(1) to the certified digits', (name) => {
    const data = readNistDataset(name);
    expect(data.values.length).toBe(data.certifiedCount);
    const stats = computeLevelStatistics(data.values);
    expect(logRelativeError(stats.mean, data.certifiedMean)).toBeGreaterThanOrEqual(MIN_DIGITS[name].mean);
    expect(logRelativeError(stats.sd, data.certifiedSd)).toBeGreaterThanOrEqual(MIN_DIGITS[name].sd);
    expect(logRelativeError(stats.lag1Autocorrelation!, data.certifiedLag1)).toBeGreaterThanOrEqual(
      MIN_DIGITS[name].lag1,
    );
  });

  it.each(DATASETS)('%s: agrees with exact rational arithmetic on the same binary64 inputs', (name) => {
    const data = readNistDataset(name);
    const stats = computeLevelStatistics(data.values);
    const ref = exactStatistics(data.values);
    expect(Math.abs(stats.mean - ref.mean) / Math.abs(ref.mean)).toBeLessThan(1e-15);
    expect(Math.abs(stats.sd - ref.sd) / ref.sd).toBeLessThan(1e-13);
    expect(Math.abs(stats.lag1Autocorrelation! - ref.lag1) / Math.abs(ref.lag1)).toBeLessThan(1e-13);
  });

  it('the same figures from a Float64Array as from a plain array', () => {
    const data = readNistDataset('NumAcc3');
    expect(computeLevelStatistics(Float64Array.from(data.values))).toEqual(computeLevelStatistics(data.values));
  });

  it('NumAcc3 defeats the naive one-pass variance, so it is a real check of stability', () => {
    const data = readNistDataset('NumAcc3');
    let sum = 0;
    let sumSq = 0;
    for (const v of data.values) {
      sum += v;
      sumSq += v * v;
    }
    const n = data.values.length;
    const naiveSd = Math.sqrt(Math.max(0, (sumSq - (sum * sum) / n) / (n - 1)));
    expect(logRelativeError(naiveSd, data.certifiedSd)).toBeLessThan(3);
  });

  it('agrees with simple-statistics sample standard deviation on every dataset', () => {
    for (const name of DATASETS) {
      const values = readNistDataset(name).values;
      const ours = computeLevelStatistics(values).sd;
      expect(Math.abs(ours - sampleStandardDeviation(values)) / ours).toBeLessThan(1e-12);
    }
  });
});

describe('level statistics: order statistics', () => {
  // Hand-checkable data; percentiles by linear interpolation between order
  // statistics (R type 7 / numpy default), as simple-statistics documents.
  it('median, p10, p90, min and max of 1…10', () => {
    const stats = computeLevelStatistics([7, 3, 10, 1, 5, 2, 9, 4, 8, 6]);
    expect(stats.median).toBe(5.5);
    expect(stats.p10).toBeCloseTo(1.9, 12);
    expect(stats.p90).toBeCloseTo(9.1, 12);
    expect(stats.min).toBe(1);
    expect(stats.max).toBe(10);
  });

  it('matches simple-statistics quantile on a Float32Array level series', () => {
    const level = new Float32Array(10_001);
    for (let i = 0; i < level.length; i++) level[i] = 20 + 10 * Math.sin(i * 0.37) + (i % 7);
    const stats = computeLevelStatistics(level);
    expect(stats.p10).toBe(quantile(Array.from(level), 0.1));
    expect(stats.median).toBe(quantile(Array.from(level), 0.5));
    expect(stats.p90).toBe(quantile(Array.from(level), 0.9));
  });

  it('one reading: sd 0, no autocorrelation; a constant series: no autocorrelation', () => {
    expect(computeLevelStatistics([42])).toMatchObject({ count: 1, mean: 42, sd: 0, lag1Autocorrelation: null });
    expect(computeLevelStatistics([3, 3, 3]).lag1Autocorrelation).toBeNull();
  });

  it('refuses an empty series and a non-finite reading', () => {
    expect(() => computeLevelStatistics([])).toThrow(RangeError);
    expect(() => computeLevelStatistics([1, Number.NaN, 2])).toThrow(/reading 1/);
  });
});

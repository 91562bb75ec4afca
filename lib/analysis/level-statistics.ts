// Summary statistics of a level (or temperature) series.
//
// Moments are computed in two passes: a compensated (Neumaier) sum for the mean,
// then sums of deviations from that mean. The naive one-pass Σx² − n·x̄² loses
// every significant digit on data with a large offset and a small spread (NIST
// StRD NumAcc3: values 1000000.1…1000000.3), which is exactly the shape of a dB
// series from a quiet trap. The second pass also carries the correction term
// Σ(x − x̄) (the "corrected two-pass" algorithm, Chan, Golub & LeVeque 1983) and the
// lag-1 autocorrelation numerator, so the whole series is read twice, not five times.
//
// Percentiles follow simple-statistics' quantile (linear interpolation between order
// statistics — R type 7), computed by ./quantiles so that two million readings are
// neither sorted nor copied.

import { quantiles } from './quantiles';

export interface LevelStatistics {
  count: number;
  mean: number;
  median: number;
  /** Sample standard deviation, denominator n − 1 (as NIST StRD certifies); 0 for one reading. */
  sd: number;
  p10: number;
  p90: number;
  min: number;
  max: number;
  /**
   * Lag-1 autocorrelation as NIST StRD defines it:
   * Σ_{i=2..n}(yᵢ−ȳ)(yᵢ₋₁−ȳ) / Σ_{i=1..n}(yᵢ−ȳ)². Null when all readings are equal.
   */
  lag1Autocorrelation: number | null;
}

type Numbers = ArrayLike<number>;

/** Mean by Neumaier-compensated summation, then one correction pass. Also min and max. */
function firstPass(x: Numbers): { mean: number; min: number; max: number } {
  const n = x.length;
  let sum = 0;
  let compensation = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = x[i];
    if (!Number.isFinite(v)) throw new RangeError(`reading ${i} is not a finite number`);
    const t = sum + v;
    compensation += Math.abs(sum) >= Math.abs(v) ? sum - t + v : v - t + sum;
    sum = t;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { mean: (sum + compensation) / n, min, max };
}

export function computeLevelStatistics(x: Numbers): LevelStatistics {
  const n = x.length;
  if (n === 0) throw new RangeError('statistics need at least one reading');
  const first = firstPass(x);
  let mean = first.mean;

  let sumDev = 0;
  let sumSq = 0;
  let sumLag = 0;
  let previous = x[0] - mean;
  sumDev = previous;
  sumSq = previous * previous;
  for (let i = 1; i < n; i++) {
    const d = x[i] - mean;
    sumDev += d;
    sumSq += d * d;
    sumLag += d * previous;
    previous = d;
  }
  // Corrected two-pass: remove the rounding left in the first-pass mean.
  const correction = sumDev / n;
  mean += correction;
  sumSq -= sumDev * correction;
  // The lag products shift by the same correction, exactly:
  // Σ(dᵢ−c)(dᵢ₋₁−c) = Σdᵢdᵢ₋₁ − c·(2·Σd − d₁ − dₙ) + (n−1)·c².
  const dFirst = x[0] - (mean - correction);
  const dLast = x[n - 1] - (mean - correction);
  sumLag += -correction * (2 * sumDev - dFirst - dLast) + (n - 1) * correction * correction;

  const [p10, median, p90] = quantiles(x, [0.1, 0.5, 0.9], first.min, first.max);
  return {
    count: n,
    mean,
    median,
    sd: n > 1 ? Math.sqrt(Math.max(0, sumSq) / (n - 1)) : 0,
    p10,
    p90,
    min: first.min,
    max: first.max,
    lag1Autocorrelation: sumSq > 0 ? sumLag / sumSq : null,
  };
}

// Exact percentiles of long series, fast.
//
// The definition is simple-statistics' quantile (linear interpolation between order
// statistics, R type 7), and short series go straight to it. A long series (two
// million readings) would be copied and partitioned once per call; instead one pass
// counts the readings into a histogram between min and max, the histogram says which
// bins hold the needed order statistics, a second pass gathers only those bins'
// readings, and selection within them gives the same order statistics exactly.

import { quantile } from 'simple-statistics';

const DIRECT_BELOW = 65_536;
const BINS = 4096;

/** The k-th smallest (0-based) of values[0…length), partly reordering values. */
export function selectK(values: Float64Array, k: number, length = values.length): number {
  // Hoare-style quickselect with median-of-three pivots; values is scratch.
  let lo = 0;
  let hi = length - 1;
  while (hi > lo) {
    const mid = (lo + hi) >> 1;
    const a = values[lo];
    const b = values[mid];
    const c = values[hi];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const t = values[i];
        values[i] = values[j];
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return values[k];
  }
  return values[k];
}

// Bin index = ⌊(v − lo)·scale⌋ by truncation (v ≥ lo, so |0 is floor); v = max lands
// in the extra last slot and is folded into the top bin. Plain functions with plain
// parameters keep these two passes over millions of readings tight.
function countBins(x: ArrayLike<number>, lo: number, scale: number): Int32Array {
  const counts = new Int32Array(BINS + 1);
  for (let i = 0; i < x.length; i++) counts[((x[i] - lo) * scale) | 0]++;
  counts[BINS - 1] += counts[BINS];
  return counts.subarray(0, BINS);
}

function gatherBins(x: ArrayLike<number>, lo: number, scale: number, slotOfBin: Int32Array, out: Float64Array[]): Float64Array[] {
  const filled = new Int32Array(out.length);
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    const slot = slotOfBin[Math.min(BINS - 1, ((v - lo) * scale) | 0)];
    if (slot >= 0) out[slot][filled[slot]++] = v;
  }
  return out;
}

/**
 * Quantile p of x[start…end) as simple-statistics defines it, using scratch (at least
 * end − start long) instead of allocating: for the many short blocks of a rolling floor.
 */
export function quantileOfRange(x: ArrayLike<number>, start: number, end: number, p: number, scratch: Float64Array): number {
  const m = end - start;
  for (let i = 0; i < m; i++) scratch[i] = x[start + i];
  const idx = (m - 1) * p;
  const k = Math.floor(idx);
  const lower = selectK(scratch, k, m);
  if (idx === k) return lower;
  // After selection everything right of k is ≥ the k-th value; the next order statistic is their minimum.
  let upper = Infinity;
  for (let i = k + 1; i < m; i++) if (scratch[i] < upper) upper = scratch[i];
  return lower + (idx - k) * (upper - lower);
}

/**
 * Quantiles ps (each 0…1) of x, exactly as simple-statistics' quantile computes them.
 * min and max of x may be passed when already known.
 */
export function quantiles(x: ArrayLike<number>, ps: readonly number[], min?: number, max?: number): number[] {
  const n = x.length;
  if (n === 0) throw new RangeError('quantiles need at least one value');
  if (n < DIRECT_BELOW) {
    const result = quantile(x as number[], ps as number[]);
    return Array.isArray(result) ? result : [result];
  }
  let lo = min ?? Infinity;
  let hi = max ?? -Infinity;
  if (min === undefined || max === undefined) {
    for (let i = 0; i < n; i++) {
      const v = x[i];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (lo === hi) return ps.map(() => lo);
  const scale = BINS / (hi - lo);
  const counts = countBins(x, lo, scale);
  const before = new Int32Array(BINS + 1); // readings in bins below b
  for (let b = 0; b < BINS; b++) before[b + 1] = before[b] + counts[b];

  // The order statistics type 7 reads: floor and ceil of (n − 1)·p.
  const ranks = new Set<number>();
  for (const p of ps) {
    if (p < 0 || p > 1) throw new RangeError('quantiles must be between 0 and 1');
    const idx = (n - 1) * p;
    ranks.add(Math.floor(idx));
    ranks.add(Math.ceil(idx));
  }
  const binOfRank = (k: number) => {
    let a = 0;
    let b = BINS - 1;
    while (a < b) {
      const m = (a + b) >> 1;
      if (before[m + 1] <= k) a = m + 1;
      else b = m;
    }
    return a;
  };
  const slotOfBin = new Int32Array(BINS).fill(-1);
  const binsNeeded: number[] = [];
  for (const k of ranks) {
    const b = binOfRank(k);
    if (slotOfBin[b] < 0) {
      slotOfBin[b] = binsNeeded.length;
      binsNeeded.push(b);
    }
  }
  const gathered = gatherBins(x, lo, scale, slotOfBin, binsNeeded.map((b) => new Float64Array(counts[b])));
  const orderStatistic = new Map<number, number>();
  for (const k of ranks) {
    const b = binOfRank(k);
    orderStatistic.set(k, selectK(gathered[slotOfBin[b]], k - before[b]));
  }
  return ps.map((p) => {
    const idx = (n - 1) * p;
    const lower = orderStatistic.get(Math.floor(idx))!;
    const upper = orderStatistic.get(Math.ceil(idx))!;
    return lower + (idx - Math.floor(idx)) * (upper - lower);
  });
}

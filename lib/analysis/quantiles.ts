// Exact percentiles of long series, fast.
//
// The definition is simple-statistics' quantile (linear interpolation between order
// statistics, R type 7); tests compare the two on every path. Very short series go
// straight to it. Otherwise copying and partitioning the whole series per call is what
// costs (a fresh copy, and a partition whose comparisons a processor cannot predict);
// instead one pass counts the readings into a histogram between min and max, the
// histogram says which bins hold the needed order statistics, a second pass gathers only
// those bins' readings, and selection within them gives the same order statistics exactly.
// A bin whose readings are all one value (a meter's resolution is often coarser than a
// bin) gives its order statistics from the count alone, without the second pass.
// The histogram and the gathered readings live in buffers kept between calls: the
// per-test analysis calls this for every test of an import, and a fresh typed array of a
// few kilobytes each time cost more than the counting itself (measured on a day of files).

import { quantile } from 'simple-statistics';

const DIRECT_BELOW = 256;
const MAX_BINS = 4096;

// Kept between calls (the analysis is synchronous: no call overlaps another).
const counts = new Int32Array(MAX_BINS + 1);
const before = new Int32Array(MAX_BINS + 1);
const slotOfBin = new Int32Array(MAX_BINS);
// Each bin's lowest and highest reading: a bin of one value (a meter's resolution is often
// coarser than a bin) gives its order statistics without the second pass.
const binLow = new Float64Array(MAX_BINS + 1);
const binHigh = new Float64Array(MAX_BINS + 1);
let gathered = new Float64Array(1 << 16);
const KEEP_GATHERED_UP_TO = 1 << 20;

/** The k-th smallest (0-based, of the whole array) within values[lo…hi], partly reordering that range. */
function selectIn(values: Float64Array, k: number, lo: number, hi: number): number {
  // Hoare-style quickselect with median-of-three pivots; values is scratch.
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

/** The k-th smallest (0-based) of values[0…length), partly reordering values. */
export function selectK(values: Float64Array, k: number, length = values.length): number {
  return selectIn(values, k, 0, length - 1);
}

// Bin index = ⌊(v − lo)·scale⌋ by truncation (v ≥ lo, so |0 is floor); v = max lands
// in the extra last slot and is folded into the top bin. Plain functions with plain
// parameters keep these two passes over the readings tight.
function countBins(x: ArrayLike<number>, lo: number, scale: number, bins: number): void {
  counts.fill(0, 0, bins + 1);
  binLow.fill(Infinity, 0, bins + 1);
  binHigh.fill(-Infinity, 0, bins + 1);
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    const b = ((v - lo) * scale) | 0;
    counts[b]++;
    if (v < binLow[b]) binLow[b] = v;
    if (v > binHigh[b]) binHigh[b] = v;
  }
  counts[bins - 1] += counts[bins];
  if (binLow[bins] < binLow[bins - 1]) binLow[bins - 1] = binLow[bins];
  if (binHigh[bins] > binHigh[bins - 1]) binHigh[bins - 1] = binHigh[bins];
}

/** Copies the readings of the bins with a slot into out, each slot's from its offset on. */
function gatherBins(x: ArrayLike<number>, lo: number, scale: number, top: number, fill: Int32Array, out: Float64Array): void {
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    const b = ((v - lo) * scale) | 0;
    const slot = slotOfBin[b > top ? top : b];
    if (slot >= 0) out[fill[slot]++] = v;
  }
}

/** Restores the max-heap heap[0…size) after heap[0] was replaced. */
function siftDown(heap: Float64Array, size: number): void {
  const v = heap[0];
  let i = 0;
  for (;;) {
    let child = 2 * i + 1;
    if (child >= size) break;
    if (child + 1 < size && heap[child + 1] > heap[child]) child++;
    if (heap[child] <= v) break;
    heap[i] = heap[child];
    i = child;
  }
  heap[i] = v;
}

/**
 * Quantile p of x[start…end) as simple-statistics defines it, using scratch (at least
 * end − start long) instead of allocating: for the many short blocks of a rolling floor.
 * A low quantile (the floor's 10th percentile) keeps only the few smallest readings in a
 * max-heap: most readings are larger than all of them, a comparison that is almost always
 * the same and so nearly free, where a partition's comparisons are not.
 */
export function quantileOfRange(x: ArrayLike<number>, start: number, end: number, p: number, scratch: Float64Array): number {
  const m = end - start;
  const idx = (m - 1) * p;
  const k = Math.floor(idx);
  const kept = Math.ceil(idx) + 1; // the smallest readings up to rank ⌈idx⌉
  if (kept * 4 <= m) {
    const heap = scratch;
    for (let i = 0; i < kept; i++) {
      // Insert x[start + i] into heap[0…i) by sifting it up.
      let j = i;
      const v = x[start + i];
      while (j > 0) {
        const parent = (j - 1) >> 1;
        if (heap[parent] >= v) break;
        heap[j] = heap[parent];
        j = parent;
      }
      heap[j] = v;
    }
    for (let i = kept; i < m; i++) {
      const v = x[start + i];
      if (v < heap[0]) {
        heap[0] = v;
        siftDown(heap, kept);
      }
    }
    const upper = heap[0];
    if (idx === k) return upper;
    // The next smaller of the kept readings is the larger of the root's children.
    const lower = kept > 2 ? Math.max(heap[1], heap[2]) : heap[1];
    return lower + (idx - k) * (upper - lower);
  }
  for (let i = 0; i < m; i++) scratch[i] = x[start + i];
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
    const result = quantile(Array.from(x), ps as number[]);
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
  // About four readings a bin for a test's thousands, up to MAX_BINS for millions.
  const bins = Math.min(MAX_BINS, Math.max(64, 2 ** Math.ceil(Math.log2(n / 4))));
  const scale = bins / (hi - lo);
  countBins(x, lo, scale, bins);
  before[0] = 0; // readings in bins below b
  for (let b = 0; b < bins; b++) before[b + 1] = before[b] + counts[b];

  // The order statistics type 7 reads: floor and ceil of (n − 1)·p.
  const ranks = new Set<number>();
  for (const p of ps) {
    if (!(p >= 0 && p <= 1)) throw new RangeError('quantiles must be between 0 and 1');
    const idx = (n - 1) * p;
    ranks.add(Math.floor(idx));
    ranks.add(Math.ceil(idx));
  }
  const binOfRank = (k: number) => {
    let a = 0;
    let b = bins - 1;
    while (a < b) {
      const m = (a + b) >> 1;
      if (before[m + 1] <= k) a = m + 1;
      else b = m;
    }
    return a;
  };
  // Each needed bin gets a slot: its readings go to out[offset…offset + count).
  slotOfBin.fill(-1, 0, bins);
  const binsNeeded: number[] = [];
  const offsets: number[] = [];
  let size = 0;
  for (const k of ranks) {
    const b = binOfRank(k);
    if (slotOfBin[b] < 0) {
      slotOfBin[b] = binsNeeded.length;
      binsNeeded.push(b);
      offsets.push(size);
      size += counts[b];
    }
  }
  if (binsNeeded.every((b) => binLow[b] === binHigh[b])) {
    const orderStatistic = new Map<number, number>();
    for (const k of ranks) orderStatistic.set(k, binLow[binOfRank(k)]);
    return interpolated(n, ps, orderStatistic);
  }
  // The kept buffer, grown as needed (and kept grown up to a limit: a bin of millions is a one-off).
  let out = gathered;
  if (out.length < size) {
    out = new Float64Array(size);
    if (size <= KEEP_GATHERED_UP_TO) gathered = out;
  }
  gatherBins(x, lo, scale, bins - 1, Int32Array.from(offsets), out);
  const orderStatistic = new Map<number, number>();
  for (const k of ranks) {
    const b = binOfRank(k);
    const offset = offsets[slotOfBin[b]];
    orderStatistic.set(k, selectIn(out, offset + k - before[b], offset, offset + counts[b] - 1));
  }
  return interpolated(n, ps, orderStatistic);
}

/** Type 7 between the order statistics: the lower one where (n − 1)·p is whole, else linear between the two. */
function interpolated(n: number, ps: readonly number[], orderStatistic: Map<number, number>): number[] {
  return ps.map((p) => {
    const idx = (n - 1) * p;
    const lower = orderStatistic.get(Math.floor(idx))!;
    if (idx % 1 === 0) return lower;
    return lower + (idx - Math.floor(idx)) * (orderStatistic.get(Math.ceil(idx))! - lower);
  });
}

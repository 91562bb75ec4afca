// The floor of the level that open and close limits are measured from.
//
// BRIEF §4a: the baseline is the 10th percentile of the smoothed level. Over a long
// test the floor may drift (the line warms, the probe settles, nearby plant starts),
// so in 'rolling' mode the test is cut into blocks, each block's 10th percentile is
// taken, the floor at a block is the lowest of those within ± windowS/2 (a block in
// which the trap stays open must not lift the floor), and the floor is interpolated
// linearly between block centres. A test no longer than windowS uses the single
// global percentile, which is the brief's definition.

import type { AnalysisParams } from './defaults';
import { quantileOfRange, quantiles } from './quantiles';
import { durationS, sampleTimeS, type Timebase } from './timebase';

export interface Baseline {
  /** Floor per reading, dB. */
  levelDb: Float32Array;
  mode: 'global' | 'rolling';
  minDb: number;
  maxDb: number;
}

function blockStarts(tb: Timebase, count: number, blockS: number): number[] {
  if (tb.kind === 'regular') {
    const length = Math.max(1, Math.round(blockS * tb.rateHz));
    const starts: number[] = [];
    for (let s = 0; s < count; s += length) starts.push(s);
    if (starts.length > 1 && count - starts[starts.length - 1] < length / 2) starts.pop();
    return starts;
  }
  const starts = [0];
  let next = sampleTimeS(tb, 0) + blockS;
  for (let i = 1; i < count; i++) {
    const t = sampleTimeS(tb, i);
    if (t >= next) {
      starts.push(i);
      next = t + blockS;
    }
  }
  // A last block shorter than half a block gives a noisy percentile: fold it into the one before.
  if (starts.length > 1 && sampleTimeS(tb, count - 1) - sampleTimeS(tb, starts[starts.length - 1]) < blockS / 2) {
    starts.pop();
  }
  return starts;
}

function rollingFloor(level: Float32Array, tb: Timebase, p: AnalysisParams['baseline'], out: Float32Array): void {
  const n = level.length;
  const starts = blockStarts(tb, n, p.blockS);
  const blocks = starts.length;
  const centre = new Float64Array(blocks);
  const blockFloor = new Float64Array(blocks);
  let longest = 0;
  for (let b = 0; b < blocks; b++) longest = Math.max(longest, (b + 1 < blocks ? starts[b + 1] : n) - starts[b]);
  const scratch = new Float64Array(longest);
  for (let b = 0; b < blocks; b++) {
    const s = starts[b];
    const e = b + 1 < blocks ? starts[b + 1] : n;
    centre[b] = 0.5 * (sampleTimeS(tb, s) + sampleTimeS(tb, e - 1));
    blockFloor[b] = quantileOfRange(level, s, e, p.quantile, scratch);
  }
  const envelope = new Float64Array(blocks);
  const half = p.windowS / 2;
  for (let b = 0; b < blocks; b++) {
    let low = Infinity;
    for (let k = b; k >= 0 && centre[b] - centre[k] <= half; k--) low = Math.min(low, blockFloor[k]);
    for (let k = b + 1; k < blocks && centre[k] - centre[b] <= half; k++) low = Math.min(low, blockFloor[k]);
    envelope[b] = low;
  }
  // Flat before the first block centre and after the last, linear in between. Reading
  // times are computed here rather than through sampleTimeS: this loop runs once per reading.
  const offsets = tb.kind === 'irregular' ? tb.offsetsS : null;
  const start = tb.kind === 'regular' ? (tb.startS ?? 0) : 0;
  const period = tb.kind === 'regular' ? 1 / tb.rateHz : 0;
  let i = 0;
  for (; i < n && (offsets ? offsets[i] : start + i * period) <= centre[0]; i++) out[i] = envelope[0];
  for (let b = 0; b + 1 < blocks; b++) {
    const t0 = centre[b];
    const t1 = centre[b + 1];
    const e0 = envelope[b];
    const slope = (envelope[b + 1] - e0) / (t1 - t0);
    for (; i < n; i++) {
      const t = offsets ? offsets[i] : start + i * period;
      if (t > t1) break;
      out[i] = e0 + (t - t0) * slope;
    }
  }
  for (; i < n; i++) out[i] = envelope[blocks - 1];
}

export function computeBaseline(level: Float32Array, tb: Timebase, p: AnalysisParams['baseline']): Baseline {
  const n = level.length;
  const out = new Float32Array(n);
  const rolling = p.mode === 'rolling' && durationS(tb, n) > p.windowS;
  if (rolling) rollingFloor(level, tb, p, out);
  else out.fill(quantiles(level, [p.quantile])[0]);
  let minDb = Infinity;
  let maxDb = -Infinity;
  for (let i = 0; i < n; i++) {
    if (out[i] < minDb) minDb = out[i];
    if (out[i] > maxDb) maxDb = out[i];
  }
  return { levelDb: out, mode: rolling ? 'rolling' : 'global', minDb, maxDb };
}

// The floor of the level that open and close limits are measured from.
//
// BRIEF §4a: the baseline is the 10th percentile of the smoothed level. Over a long
// test the floor may drift (the line warms, the probe settles, nearby plant starts),
// so in 'rolling' mode the test is cut into blocks, each block's 10th percentile is
// taken, the floor at a block is the lowest of those within ± windowS/2 (a block in
// which the trap stays open must not lift the floor), and the floor is interpolated
// linearly between block centres. A test no longer than windowS uses the single
// global percentile, which is the brief's definition.

import { quantile } from 'simple-statistics';
import type { AnalysisParams } from './defaults';
import { durationS, sampleTimeS, type Timebase } from './timebase';

export interface Baseline {
  /** Floor per reading, dB. */
  levelDb: Float32Array;
  mode: 'global' | 'rolling';
  /** The global quantile of the smoothed level, dB. */
  globalDb: number;
  minDb: number;
  maxDb: number;
}

function blockStarts(tb: Timebase, count: number, blockS: number): number[] {
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
  for (let b = 0; b < blocks; b++) {
    const s = starts[b];
    const e = b + 1 < blocks ? starts[b + 1] : n;
    centre[b] = 0.5 * (sampleTimeS(tb, s) + sampleTimeS(tb, e - 1));
    blockFloor[b] = quantile(level.subarray(s, e) as unknown as number[], p.quantile);
  }
  const envelope = new Float64Array(blocks);
  const half = p.windowS / 2;
  for (let b = 0; b < blocks; b++) {
    let low = Infinity;
    for (let k = b; k >= 0 && centre[b] - centre[k] <= half; k--) low = Math.min(low, blockFloor[k]);
    for (let k = b + 1; k < blocks && centre[k] - centre[b] <= half; k++) low = Math.min(low, blockFloor[k]);
    envelope[b] = low;
  }
  let b = 0;
  for (let i = 0; i < n; i++) {
    const t = sampleTimeS(tb, i);
    while (b + 1 < blocks && centre[b + 1] <= t) b++;
    if (t <= centre[0]) out[i] = envelope[0];
    else if (b + 1 >= blocks) out[i] = envelope[blocks - 1];
    else {
      const f = (t - centre[b]) / (centre[b + 1] - centre[b]);
      out[i] = envelope[b] + f * (envelope[b + 1] - envelope[b]);
    }
  }
}

export function computeBaseline(level: Float32Array, tb: Timebase, p: AnalysisParams['baseline']): Baseline {
  const n = level.length;
  const globalDb = quantile(level as unknown as number[], p.quantile);
  const out = new Float32Array(n);
  const rolling = p.mode === 'rolling' && durationS(tb, n) > p.windowS;
  if (rolling) rollingFloor(level, tb, p, out);
  else out.fill(globalDb);
  let minDb = Infinity;
  let maxDb = -Infinity;
  for (let i = 0; i < n; i++) {
    if (out[i] < minDb) minDb = out[i];
    if (out[i] > maxDb) maxDb = out[i];
  }
  return { levelDb: out, mode: rolling ? 'rolling' : 'global', globalDb, minDb, maxDb };
}

// Click rejection: a short moving median of the level.
//
// A median of 3 removes a run of one high reading and keeps a run of two, so it
// only helps where one reading is shorter than any real discharge. BRIEF §4a: the
// minimum dwell is 0.2 s, so at ≥ 10 Hz a real opening spans at least two readings
// and a lone high reading is a click (a knock on the probe, a passing impact).
// Below 10 Hz one reading may be a whole real opening (a 0.3 s disc discharge at
// 2 Hz is one partial reading) and nothing is removed.

import type { AnalysisParams } from './defaults';

export interface SmoothedLevel {
  level: Float32Array;
  clickRejection: boolean;
  windowSamples: number;
}

function median3(a: number, b: number, c: number): number {
  if (a > b) [a, b] = [b, a];
  return c <= a ? a : c >= b ? b : c;
}

function movingMedian(x: Float32Array, window: number): Float32Array {
  const n = x.length;
  const out = new Float32Array(x);
  const half = window >> 1;
  if (n < window) return out;
  if (window === 3) {
    for (let i = 1; i < n - 1; i++) out[i] = median3(x[i - 1], x[i], x[i + 1]);
    return out;
  }
  const scratch = new Float64Array(window);
  for (let i = half; i < n - half; i++) {
    for (let k = 0; k < window; k++) scratch[k] = x[i - half + k];
    scratch.sort();
    out[i] = scratch[half];
  }
  return out;
}

export function smoothLevel(level: Float32Array, periodS: number, p: AnalysisParams['smoothing']): SmoothedLevel {
  const rateHz = 1 / periodS;
  // A small tolerance so a nominal 10 Hz meter whose clock reads 9.9996 Hz is treated as 10 Hz.
  if (rateHz < p.clickRejectionMinRateHz * 0.999 || p.medianWindowSamples < 3) {
    return { level, clickRejection: false, windowSamples: 1 };
  }
  return { level: movingMedian(level, p.medianWindowSamples), clickRejection: true, windowSamples: p.medianWindowSamples };
}

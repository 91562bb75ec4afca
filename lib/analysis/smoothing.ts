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

// Branch-free median of three: min(a, b) = (a + b − |a − b|)/2 and so on. On noisy
// levels the comparisons of a branching median mispredict about half the time, which
// made it twice as slow. For float32 readings every sum here is exact in float64, so
// the result is exactly one of a, b, c.
function median3(a: number, b: number, c: number): number {
  const sum = a + b;
  const diff = Math.abs(a - b);
  const lo = (sum - diff) * 0.5;
  const hi = (sum + diff) * 0.5;
  const upper = (hi + c - Math.abs(hi - c)) * 0.5; // min(hi, c)
  return (lo + upper + Math.abs(lo - upper)) * 0.5; // max(lo, min(hi, c))
}

function movingMedian(x: Float32Array, window: number): Float32Array {
  const n = x.length;
  const out = new Float32Array(x);
  const half = window >> 1;
  if (n < window) return out;
  if (window === 3) {
    let a = x[0];
    let b = x[1];
    for (let i = 1; i < n - 1; i++) {
      const c = x[i + 1];
      out[i] = median3(a, b, c);
      a = b;
      b = c;
    }
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

// Open and closed intervals of a trap from its smoothed level.
//
// Hysteresis (BRIEF §4a): the trap opens when the level rises above floor + 8 dB and
// closes when it falls below floor + 4 dB, so noise around one limit cannot toggle it.
// Minimum dwell: closed gaps shorter than max(0.2 s, one period) between two openings
// are chatter and merge into one opening; then openings shorter than the dwell are
// dropped. At 2 Hz one reading lasts 0.5 s, longer than the dwell, so a single high
// reading stays an opening.
//
// Partly open edge readings: a meter that reports the level over each sample period
// shows a 0.3 s discharge at 2 Hz as one reading part-way up. Counting that reading as
// a full period open would overstate the duty cycle by 0.2 s per discharge, and a
// discharge straddling two readings by up to 0.7 s. With `edgeFractions`, the first and
// last reading of each opening is credited with the share f of its period that was
// open, found in the power domain where sound energies add:
//   10^(L/10) = f·10^(R/10) + (1 − f)·10^(B/10)
// with B the floor and R the test's open level (median of the readings inside
// openings; the highest opening reading when no opening has an inside).
//
// With no transition at all, the floor-relative limits cannot tell "always open" from
// "always closed"; the absolute bands decide: a test mostly above the quiet band is one
// continuous opening (duty cycle 1, no cycles), otherwise one closed interval.

import type { AnalysisParams } from './defaults';
import { boundaryS, cellWidthS, durationS, type Timebase } from './timebase';
import { quantiles } from './quantiles';

export interface Interval {
  /** Start and end of the readings' cells, s from the test start (for plotting). */
  startS: number;
  endS: number;
  /** Estimated time in this state, s; differs from endS − startS where an edge reading was partly open. */
  durationS: number;
  /** Time-weighted mean of the smoothed level, dB. */
  meanDb: number;
  maxDb: number;
  /** Readings startIndex … endIndex − 1. */
  startIndex: number;
  endIndex: number;
}

export interface CycleAnalysis {
  openIntervals: Interval[];
  closedIntervals: Interval[];
  /** True when no transition was seen and the level stayed mostly above the quiet band. */
  continuousFlow: boolean;
  testDurationS: number;
  samplePeriodS: number;
  minDwellS: number;
  /** Open time ÷ test time. */
  dutyCycle: number;
  /** Openings per minute of test time; 0 for continuous flow. */
  cyclesPerMinute: number;
  /** Mean time from one opening to the next; null with fewer than two openings. */
  meanCyclePeriodS: number | null;
  /** Mean durations over the intervals that lie wholly inside the test (all of them when none does). */
  meanOpenS: number | null;
  meanClosedS: number | null;
  /** Time-weighted mean smoothed level over all closed intervals, dB; null when never closed. */
  meanClosedDb: number | null;
  /** The open level used for partly open edge readings, dB; null without openings. */
  openReferenceDb: number | null;
}

interface Run {
  start: number;
  end: number;
  fFirst: number;
  fLast: number;
}

function spanS(tb: Timebase, n: number, start: number, end: number): number {
  return boundaryS(tb, n, end) - boundaryS(tb, n, start);
}

function weightedMean(level: Float32Array, tb: Timebase, n: number, start: number, end: number): number {
  let sum = 0;
  if (tb.kind === 'regular') {
    for (let i = start; i < end; i++) sum += level[i];
    return sum / (end - start);
  }
  let weight = 0;
  for (let i = start; i < end; i++) {
    const w = cellWidthS(tb, n, i);
    sum += level[i] * w;
    weight += w;
  }
  return sum / weight;
}

function maxOf(level: Float32Array, start: number, end: number): number {
  let m = -Infinity;
  for (let i = start; i < end; i++) if (level[i] > m) m = level[i];
  return m;
}

function hysteresisRuns(level: Float32Array, floor: Float32Array, p: AnalysisParams['intervals']): Run[] {
  const runs: Run[] = [];
  let open = false;
  let start = 0;
  for (let i = 0; i < level.length; i++) {
    const rise = level[i] - floor[i];
    if (!open && rise > p.openAboveBaselineDb) {
      open = true;
      start = i;
    } else if (open && rise < p.closeAboveBaselineDb) {
      open = false;
      runs.push({ start, end: i, fFirst: 1, fLast: 1 });
    }
  }
  if (open) runs.push({ start, end: level.length, fFirst: 1, fLast: 1 });
  return runs;
}

function applyDwell(runs: Run[], tb: Timebase, n: number, minDwellS: number): Run[] {
  // Compare with a hair of tolerance: one reading at exactly the dwell must count.
  const dwell = minDwellS - 1e-9;
  const merged: Run[] = [];
  for (const run of runs) {
    const last = merged[merged.length - 1];
    if (last && spanS(tb, n, last.end, run.start) < dwell) last.end = run.end;
    else merged.push({ ...run });
  }
  return merged.filter((run) => spanS(tb, n, run.start, run.end) >= dwell);
}

function openReferenceDb(level: Float32Array, runs: Run[]): number {
  let inside = 0;
  for (const r of runs) inside += Math.max(0, r.end - r.start - 2);
  if (inside >= 3) {
    // At most ~20,000 inside readings are enough for a median; keeps long tests fast.
    const step = Math.ceil(inside / 20_000);
    // Float32, as the level itself: the quantiles' passes then see one kind of array only.
    const picked = new Float32Array(Math.ceil(inside / step));
    let k = 0;
    let count = 0;
    for (const r of runs) {
      for (let i = r.start + 1; i < r.end - 1; i++, k++) if (k % step === 0) picked[count++] = level[i];
    }
    return quantiles(picked.subarray(0, count), [0.5])[0];
  }
  let m = -Infinity;
  for (const r of runs) m = Math.max(m, maxOf(level, r.start, r.end));
  return m;
}

function openFraction(levelDb: number, floorDb: number, referenceDb: number): number {
  const floorPower = 10 ** (floorDb / 10);
  const span = 10 ** (referenceDb / 10) - floorPower;
  if (!(span > 0)) return 1;
  return Math.min(1, Math.max(0, (10 ** (levelDb / 10) - floorPower) / span));
}

function makeInterval(
  level: Float32Array,
  tb: Timebase,
  n: number,
  start: number,
  end: number,
  duration: number,
): Interval {
  return {
    startS: boundaryS(tb, n, start),
    endS: boundaryS(tb, n, end),
    durationS: duration,
    meanDb: weightedMean(level, tb, n, start, end),
    maxDb: maxOf(level, start, end),
    startIndex: start,
    endIndex: end,
  };
}

function meanDuration(intervals: Interval[], n: number): number | null {
  if (intervals.length === 0) return null;
  const inside = intervals.filter((iv) => iv.startIndex > 0 && iv.endIndex < n);
  const use = inside.length > 0 ? inside : intervals;
  return use.reduce((a, iv) => a + iv.durationS, 0) / use.length;
}

function shareAbove(level: Float32Array, tb: Timebase, n: number, limitDb: number): number {
  let above = 0;
  for (let i = 0; i < n; i++) if (level[i] > limitDb) above += tb.kind === 'regular' ? 1 : cellWidthS(tb, n, i);
  return tb.kind === 'regular' ? above / n : above / durationS(tb, n);
}

export function detectCycles(
  level: Float32Array,
  floor: Float32Array,
  tb: Timebase,
  quietMaxDb: number,
  samplePeriodS: number,
  p: AnalysisParams['intervals'],
): CycleAnalysis {
  const n = level.length;
  const testDurationS = durationS(tb, n);
  const minDwellS = Math.max(p.minDwellS, samplePeriodS);
  let runs = applyDwell(hysteresisRuns(level, floor, p), tb, n, minDwellS);

  const continuousFlow = runs.length === 0 && shareAbove(level, tb, n, quietMaxDb) >= p.continuousAboveQuietShare;
  if (continuousFlow) runs = [{ start: 0, end: n, fFirst: 1, fLast: 1 }];

  const reference = runs.length > 0 && !continuousFlow ? openReferenceDb(level, runs) : null;
  if (reference !== null && p.edgeFractions) {
    for (const r of runs) {
      if (r.start > 0) r.fFirst = openFraction(level[r.start], floor[r.start], reference);
      if (r.end < n) r.fLast = openFraction(level[r.end - 1], floor[r.end - 1], reference);
      if (r.end - r.start === 1) r.fFirst = r.fLast = Math.min(r.fFirst, r.fLast);
    }
  }

  const openIntervals: Interval[] = [];
  const closedIntervals: Interval[] = [];
  let previousEnd = 0;
  let carry = 0; // closed time left over in the last reading of the previous opening
  for (const r of runs) {
    const wFirst = cellWidthS(tb, n, r.start);
    const wLast = cellWidthS(tb, n, r.end - 1);
    const notOpenFirst = (1 - r.fFirst) * wFirst;
    const notOpenLast = r.end - r.start === 1 ? 0 : (1 - r.fLast) * wLast;
    if (r.start > previousEnd) {
      const closedS = spanS(tb, n, previousEnd, r.start) + carry + notOpenFirst;
      closedIntervals.push(makeInterval(level, tb, n, previousEnd, r.start, closedS));
    }
    openIntervals.push(makeInterval(level, tb, n, r.start, r.end, spanS(tb, n, r.start, r.end) - notOpenFirst - notOpenLast));
    previousEnd = r.end;
    carry = r.end - r.start === 1 ? 0 : notOpenLast;
  }
  if (previousEnd < n) {
    closedIntervals.push(makeInterval(level, tb, n, previousEnd, n, spanS(tb, n, previousEnd, n) + carry));
  }

  const openS = openIntervals.reduce((a, iv) => a + iv.durationS, 0);
  const closedSpanS = closedIntervals.reduce((a, iv) => a + (iv.endS - iv.startS), 0);
  const meanClosedDb =
    closedIntervals.length > 0
      ? closedIntervals.reduce((a, iv) => a + iv.meanDb * (iv.endS - iv.startS), 0) / closedSpanS
      : null;
  const openings = continuousFlow ? 0 : openIntervals.length;
  return {
    openIntervals,
    closedIntervals,
    continuousFlow,
    testDurationS,
    samplePeriodS,
    minDwellS,
    dutyCycle: openS / testDurationS,
    cyclesPerMinute: openings / (testDurationS / 60),
    meanCyclePeriodS:
      openings >= 2 ? (openIntervals[openings - 1].startS - openIntervals[0].startS) / (openings - 1) : null,
    meanOpenS: meanDuration(openIntervals, n),
    meanClosedS: meanDuration(closedIntervals, n),
    meanClosedDb,
    openReferenceDb: reference,
  };
}

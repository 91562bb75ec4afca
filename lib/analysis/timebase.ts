// When each reading was taken. A test is either sampled at a constant rate from
// a start offset, or carries its own time offsets (seconds from the test start,
// strictly increasing) when the meter's clock is irregular.
//
// Each reading stands for a cell of time around it: cell boundaries lie halfway
// between neighbouring readings, and the first and last cells extend half a
// period beyond the first and last readings. At a constant rate every cell is
// one period long and the test lasts n periods, which is what "duty cycle =
// open time ÷ test time" needs when a single reading is an opening.

export type Timebase =
  | { kind: 'regular'; rateHz: number; startS?: number }
  | { kind: 'irregular'; offsetsS: Float64Array };

export function regularTimebase(rateHz: number, startS = 0): Timebase {
  return { kind: 'regular', rateHz, startS };
}

export function irregularTimebase(offsetsS: Float64Array): Timebase {
  return { kind: 'irregular', offsetsS };
}

/** Throws a RangeError when the timebase cannot describe `count` readings. */
export function checkTimebase(tb: Timebase, count: number): void {
  if (count < 1) throw new RangeError('a test needs at least one reading');
  if (tb.kind === 'regular') {
    if (!(tb.rateHz > 0) || !Number.isFinite(tb.rateHz)) throw new RangeError('sample rate must be a positive number');
    return;
  }
  const t = tb.offsetsS;
  if (t.length !== count) throw new RangeError(`${t.length} time offsets for ${count} readings`);
  if (count < 2) throw new RangeError('an irregular timebase needs at least two readings');
  for (let i = 1; i < count; i++) {
    if (!(t[i] > t[i - 1])) throw new RangeError(`time offsets must increase strictly (reading ${i})`);
  }
}

/** Time of reading i. */
export function sampleTimeS(tb: Timebase, i: number): number {
  return tb.kind === 'regular' ? (tb.startS ?? 0) + i / tb.rateHz : tb.offsetsS[i];
}

/** Time of the boundary before cell i (i = 0…count; i = count is the end of the test). */
export function boundaryS(tb: Timebase, count: number, i: number): number {
  if (tb.kind === 'regular') return (tb.startS ?? 0) + (i - 0.5) / tb.rateHz;
  const t = tb.offsetsS;
  if (i <= 0) return t[0] - 0.5 * (t[1] - t[0]);
  if (i >= count) return t[count - 1] + 0.5 * (t[count - 1] - t[count - 2]);
  return 0.5 * (t[i - 1] + t[i]);
}

export function cellWidthS(tb: Timebase, count: number, i: number): number {
  if (tb.kind === 'regular') return 1 / tb.rateHz;
  return boundaryS(tb, count, i + 1) - boundaryS(tb, count, i);
}

export function durationS(tb: Timebase, count: number): number {
  return boundaryS(tb, count, count) - boundaryS(tb, count, 0);
}

/**
 * The typical sample period: 1/rate, or the median spacing of an irregular
 * timebase (estimated from at most ~4,000 evenly spread spacings to stay fast).
 */
export function typicalPeriodS(tb: Timebase, count: number): number {
  if (tb.kind === 'regular') return 1 / tb.rateHz;
  const t = tb.offsetsS;
  const gaps = count - 1;
  const step = Math.max(1, Math.floor(gaps / 4096));
  const picked: number[] = [];
  for (let i = 1; i <= gaps; i += step) picked.push(t[i] - t[i - 1]);
  picked.sort((a, b) => a - b);
  const mid = picked.length >> 1;
  return picked.length % 2 ? picked[mid] : 0.5 * (picked[mid - 1] + picked[mid]);
}

// Min/max decimation of a series for plotting (BRIEF §7: a test's plot is drawn within
// 100 ms whatever its length, so the server sends at most a few thousand points).
//
// The series is cut into `buckets` equal spans — of time when reading times are given
// (a plot's pixel columns are time), else of reading index — and each bucket keeps its
// lowest and its highest reading, in the order they were taken. Drawn as a line, the
// result covers exactly the vertical extent the full series covers in each column, so
// a one-reading discharge spike or a quiet dip is never averaged away (which is what a
// mean or every-k-th-reading decimation would do). The method is the usual min/max
// envelope of waveform displays; no single source is cited.
//
// Non-finite values (temperature gaps are NaN) are not drawn; a bucket that has readings
// but no finite one keeps one NaN point, so the plot shows the gap as a break.

export interface DecimatedSeries {
  /** Reading time (from `times`) or, without times, the reading index. */
  x: Float64Array;
  y: Float64Array;
  /** Index of each kept reading in the input. */
  index: Uint32Array;
}

function keepAll(times: ArrayLike<number> | null | undefined, values: ArrayLike<number>): DecimatedSeries {
  const n = values.length;
  const out = { x: new Float64Array(n), y: new Float64Array(n), index: new Uint32Array(n) };
  for (let i = 0; i < n; i++) {
    out.x[i] = times ? times[i] : i;
    out.y[i] = values[i];
    out.index[i] = i;
  }
  return out;
}

/**
 * At most 2 · buckets points. A series that already has no more than that many
 * readings is returned whole (copied).
 */
export function decimateMinMax(
  times: ArrayLike<number> | null | undefined,
  values: ArrayLike<number>,
  buckets: number,
): DecimatedSeries {
  const n = values.length;
  if (!Number.isInteger(buckets) || buckets < 1) throw new RangeError(`buckets must be a whole number ≥ 1, got ${buckets}`);
  if (times && times.length !== n) throw new RangeError(`${times.length} times for ${n} values`);
  if (n <= 2 * buckets) return keepAll(times, values);

  const x = new Float64Array(2 * buckets);
  const y = new Float64Array(2 * buckets);
  const index = new Uint32Array(2 * buckets);
  let m = 0;
  const push = (i: number) => {
    x[m] = times ? times[i] : i;
    y[m] = values[i];
    index[m] = i;
    m++;
  };

  const t0 = times ? times[0] : 0;
  const span = times ? times[n - 1] - t0 : n;
  let i = 0;
  for (let b = 0; b < buckets && i < n; b++) {
    // Bucket b holds readings up to (not including) this bound; the last takes the rest.
    const last = b === buckets - 1;
    const bound = times ? t0 + (span * (b + 1)) / buckets : Math.round((n * (b + 1)) / buckets);
    const start = i;
    let lo = -1;
    let hi = -1;
    for (; i < n && (last || (times ? times[i] < bound : i < bound)); i++) {
      const v = values[i];
      if (!(v - v === 0)) continue;
      if (lo < 0 || v < values[lo]) lo = i;
      if (hi < 0 || v > values[hi]) hi = i;
    }
    if (i === start) continue; // an empty time bucket (a gap in an irregular series)
    if (lo < 0) push(start);
    else if (lo === hi) push(lo);
    else if (lo < hi) {
      push(lo);
      push(hi);
    } else {
      push(hi);
      push(lo);
    }
  }
  return { x: x.slice(0, m), y: y.slice(0, m), index: index.slice(0, m) };
}

import { describe, expect, it } from 'vitest';
import { decimateMinMax } from '@/lib/analysis/decimate';
import { seededRandom } from './synthetic-signal';

// The property a min/max envelope promises (a plot of it spans, per bucket, exactly
// what the full series spans): checked against a brute-force pass over each bucket.
function bruteEnvelope(times: Float64Array | null, values: Float64Array, buckets: number) {
  const n = values.length;
  const t0 = times ? times[0] : 0;
  const span = times ? times[n - 1] - t0 : n;
  const out: Array<{ min: number; max: number } | null> = Array.from({ length: buckets }, () => null);
  for (let i = 0; i < n; i++) {
    const x = times ? times[i] : i;
    let b = times ? Math.floor(((x - t0) / span) * buckets) : -1;
    if (!times) for (b = 0; b < buckets - 1 && i >= Math.round((n * (b + 1)) / buckets); b++);
    b = Math.min(buckets - 1, b);
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    const o = out[b];
    out[b] = o ? { min: Math.min(o.min, v), max: Math.max(o.max, v) } : { min: v, max: v };
  }
  return out;
}

describe('decimateMinMax', () => {
  const random = seededRandom(7);
  const n = 100_000;
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = 20 + 5 * random();
  values[31_337] = 80; // a one-reading discharge
  values[77_001] = 2; // a one-reading dip

  it.each([10, 333, 1000])('keeps each bucket’s min and max in reading order (%i buckets, by index)', (buckets) => {
    const d = decimateMinMax(null, values, buckets);
    expect(d.y.length).toBeLessThanOrEqual(2 * buckets);
    for (let k = 1; k < d.index.length; k++) expect(d.index[k]).toBeGreaterThan(d.index[k - 1]);
    for (let k = 0; k < d.index.length; k++) expect(d.y[k]).toBe(values[d.index[k]]);
    expect(Array.from(d.y)).toContain(80);
    expect(Array.from(d.y)).toContain(2);
    const want = bruteEnvelope(null, values, buckets);
    const got: Array<{ min: number; max: number } | null> = Array.from({ length: buckets }, () => null);
    // Which bucket each kept point came from, by the same index bounds.
    for (let k = 0; k < d.index.length; k++) {
      let b = 0;
      while (b < buckets - 1 && d.index[k] >= Math.round((n * (b + 1)) / buckets)) b++;
      const o = got[b];
      got[b] = o ? { min: Math.min(o.min, d.y[k]), max: Math.max(o.max, d.y[k]) } : { min: d.y[k], max: d.y[k] };
    }
    expect(got).toEqual(want);
  });

  it('buckets by time when times are given, and an empty stretch of time yields no points', () => {
    // Readings at 0…9.999 s and 20…29.999 s: the gap in the middle has no readings.
    const m = 20_000;
    const times = new Float64Array(m);
    const v = new Float64Array(m);
    for (let i = 0; i < m; i++) {
      times[i] = i < m / 2 ? i / 1000 : 20 + (i - m / 2) / 1000;
      v[i] = Math.sin(i / 50);
    }
    const d = decimateMinMax(times, v, 30);
    expect(Array.from(d.x).some((x) => x > 10.5 && x < 19.5)).toBe(false);
    const want = bruteEnvelope(times, v, 30).filter(Boolean);
    expect(d.y.length).toBe(want.reduce((s, w) => s + (w!.min === w!.max ? 1 : 2), 0));
    for (let k = 0; k < d.x.length; k++) expect(d.x[k]).toBe(times[d.index[k]]);
  });

  it('keeps a NaN point for a bucket with readings but no finite one, so the gap shows', () => {
    const v = new Float64Array(1000).fill(150);
    for (let i = 400; i < 600; i++) v[i] = NaN;
    const d = decimateMinMax(null, v, 10);
    const nanAt = Array.from(d.index).filter((_, k) => Number.isNaN(d.y[k]));
    expect(nanAt).toEqual([400, 500]);
  });

  it('returns a short series whole, and refuses nonsense', () => {
    const d = decimateMinMax([0, 1, 2], [5, 6, 7], 2);
    expect(Array.from(d.y)).toEqual([5, 6, 7]);
    expect(Array.from(d.x)).toEqual([0, 1, 2]);
    expect(() => decimateMinMax(null, [1, 2, 3], 0)).toThrow(RangeError);
    expect(() => decimateMinMax([0, 1], [1, 2, 3], 1)).toThrow(/2 times for 3 values/);
  });
});

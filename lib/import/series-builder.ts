import type { NormalisedTest, PointRole, TestSource } from './normalised-test';

/**
 * Accumulates one test's readings in growable typed arrays and finishes it:
 * sort (only if a row went backwards), collapse duplicate times, derive the
 * sample rate. Per reading it keeps 20 bytes (time, level, temperature, line).
 */

export interface FinishNotes {
  /** [kept line, dropped line] of each duplicate time. */
  duplicates: [number, number][];
  duplicateCount: number;
}

/** Interval spread tolerated as "constant rate": 2 % of the interval, at least about 1 ms of timestamp resolution. */
const REGULAR_TOLERANCE = 0.02;
const RESOLUTION_MS = 1.01;
const MAX_LISTED_DUPLICATES = 50;

export class SeriesBuilder {
  n = 0;
  private t: Float64Array;
  private level: Float32Array;
  private temp: Float32Array | null;
  private lines: Int32Array;
  backwards = 0;
  private readonly firstDeltas: number[] = [];
  periodMs = NaN;

  constructor(
    readonly tag: string,
    readonly role: PointRole,
    hasTemperature: boolean,
    capacity = 1024,
  ) {
    this.t = new Float64Array(capacity);
    this.level = new Float32Array(capacity);
    this.temp = hasTemperature ? new Float32Array(capacity) : null;
    this.lines = new Int32Array(capacity);
  }

  get lastTime(): number {
    return this.t[this.n - 1];
  }

  private grow(): void {
    const cap = this.t.length * 2;
    const t = new Float64Array(cap);
    t.set(this.t);
    this.t = t;
    const l = new Float32Array(cap);
    l.set(this.level);
    this.level = l;
    if (this.temp) {
      const tt = new Float32Array(cap);
      tt.set(this.temp);
      this.temp = tt;
    }
    const li = new Int32Array(cap);
    li.set(this.lines);
    this.lines = li;
  }

  add(timeMs: number, levelDb: number, tempC: number, line: number): void {
    if (this.n === this.t.length) this.grow();
    const i = this.n++;
    if (i > 0 && this.firstDeltas.length < 16) {
      const d = timeMs - this.t[i - 1];
      if (d > 0) {
        this.firstDeltas.push(d);
        if (this.firstDeltas.length >= 3) {
          const s = [...this.firstDeltas].sort((a, b) => a - b);
          this.periodMs = s[s.length >> 1];
        }
      }
    }
    this.t[i] = timeMs;
    this.level[i] = levelDb;
    if (this.temp) this.temp[i] = tempC;
    this.lines[i] = line;
  }

  finish(source: Omit<TestSource, 'firstLine' | 'lastLine'>, knownRateHz: number | null): { test: NormalisedTest; notes: FinishNotes } {
    let n = this.n;
    let t = this.t.subarray(0, n);
    let level = this.level.subarray(0, n);
    let temp = this.temp ? this.temp.subarray(0, n) : null;
    let lines = this.lines.subarray(0, n);
    if (this.backwards > 0) {
      // Stable sort by time through an index permutation; equal times keep row order.
      const idx = new Uint32Array(n);
      for (let i = 0; i < n; i++) idx[i] = i;
      const tt = t;
      const order = Array.from(idx).sort((a, b) => tt[a] - tt[b] || a - b);
      const t2 = new Float64Array(n);
      const l2 = new Float32Array(n);
      const p2 = temp ? new Float32Array(n) : null;
      const li2 = new Int32Array(n);
      for (let k = 0; k < n; k++) {
        const j = order[k];
        t2[k] = t[j];
        l2[k] = level[j];
        if (p2 && temp) p2[k] = temp[j];
        li2[k] = lines[j];
      }
      t = t2;
      level = l2;
      temp = p2;
      lines = li2;
    }
    // Collapse equal times: the first reading is kept, the others reported.
    const notes: FinishNotes = { duplicates: [], duplicateCount: 0 };
    let w = 1;
    for (let r = 1; r < n; r++) {
      if (t[r] === t[w - 1]) {
        notes.duplicateCount++;
        if (notes.duplicates.length < MAX_LISTED_DUPLICATES) notes.duplicates.push([lines[w - 1], lines[r]]);
        continue;
      }
      if (w !== r) {
        t[w] = t[r];
        level[w] = level[r];
        if (temp) temp[w] = temp[r];
        lines[w] = lines[r];
      }
      w++;
    }
    n = Math.min(n, w);
    const start = t[0];
    let rate = knownRateHz ?? 0;
    let offsets: Float64Array | null = null;
    if (n >= 2) {
      const deltas = new Float64Array(n - 1);
      for (let i = 1; i < n; i++) deltas[i - 1] = t[i] - t[i - 1];
      const sorted = deltas.slice().sort();
      const median = sorted[(n - 1) >> 1];
      const tol = Math.max(REGULAR_TOLERANCE * median, RESOLUTION_MS);
      const regular = sorted[0] >= median - tol && sorted[n - 2] <= median + tol;
      const spanS = (t[n - 1] - start) / 1000;
      if (regular) rate = (n - 1) / spanS;
      else {
        rate = 1000 / median;
        offsets = new Float64Array(n);
        for (let i = 0; i < n; i++) offsets[i] = (t[i] - start) / 1000;
      }
    }
    let firstLine = Infinity;
    let lastLine = -Infinity;
    for (let i = 0; i < n; i++) {
      if (lines[i] < firstLine) firstLine = lines[i];
      if (lines[i] > lastLine) lastLine = lines[i];
    }
    const test: NormalisedTest = {
      tag: this.tag,
      role: this.role,
      linkedTrapTag: null,
      startedAt: start,
      sampleRateHz: rate,
      timeOffsetsS: offsets,
      sampleCount: n,
      durationS: n >= 2 ? (t[n - 1] - start) / 1000 : 0,
      // Copies of exact length, so the growth slack of the builders is freed.
      levelDb: level.slice(0, n),
      temperatureC: temp ? temp.slice(0, n) : null,
      source: { ...source, firstLine, lastLine },
      duplicatesCollapsed: notes.duplicateCount,
      backwardsJumps: this.backwards,
    };
    return { test, notes };
  }
}

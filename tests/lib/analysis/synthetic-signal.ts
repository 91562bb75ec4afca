// Synthetic level series with a known open/closed schedule, for interval and
// verdict tests. Model (ours): each reading reports the mean sound power over its
// sample period (the cell from half a period before to half a period after its
// time), so a discharge shorter than a period shows as one partial rise; sound
// powers add, so level = 10·log10(f·10^(open/10) + (1 − f)·10^(closed/10)) for an
// open share f of the cell. Noise is Gaussian in dB from a seeded generator, so
// every run is the same.

export interface SignalSpec {
  rateHz: number;
  durationS: number;
  /** [start, end) of each opening, s from the start of the first cell. */
  openings: Array<[number, number]>;
  closedDb: number | ((t: number) => number);
  openDb: number | ((t: number) => number);
  noiseDb?: number;
  seed?: number;
  /** Reading indices that get a one-reading click added. */
  clicks?: number[];
  clickDb?: number;
  /** Shift each reading's time by up to ± this share of a period (irregular clock). */
  jitter?: number;
}

export interface Signal {
  level: Float32Array;
  /** Present with jitter: reading times. */
  offsetsS: Float64Array | null;
  /** Open time ÷ test time, from the schedule. */
  trueDuty: number;
  testDurationS: number;
}

export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function gaussian(random: () => number): number {
  const u = Math.max(random(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
}

const at = (v: number | ((t: number) => number), t: number) => (typeof v === 'function' ? v(t) : v);

function overlap(a0: number, a1: number, b0: number, b1: number): number {
  return Math.max(0, Math.min(a1, b1) - Math.max(a0, b0));
}

export function makeSignal(spec: SignalSpec): Signal {
  const period = 1 / spec.rateHz;
  const n = Math.round(spec.durationS * spec.rateHz);
  const random = seededRandom(spec.seed ?? 1);
  const times = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const jitter = spec.jitter ? (random() * 2 - 1) * spec.jitter * period : 0;
    times[i] = (i + 0.5) * period + jitter;
  }
  // Cell boundaries as lib/analysis/timebase.ts defines them.
  const boundary = (i: number) =>
    i <= 0 ? times[0] - 0.5 * (times[1] - times[0]) : i >= n ? times[n - 1] + 0.5 * (times[n - 1] - times[n - 2]) : 0.5 * (times[i - 1] + times[i]);
  const level = new Float32Array(n);
  const clicks = new Set(spec.clicks ?? []);
  let openTime = 0;
  for (let i = 0; i < n; i++) {
    const c0 = boundary(i);
    const c1 = boundary(i + 1);
    let open = 0;
    for (const [s, e] of spec.openings) open += overlap(c0, c1, s, e);
    openTime += open;
    const f = Math.min(1, open / (c1 - c0));
    const t = times[i];
    const power = f * 10 ** (at(spec.openDb, t) / 10) + (1 - f) * 10 ** (at(spec.closedDb, t) / 10);
    level[i] = 10 * Math.log10(power) + (spec.noiseDb ?? 0) * gaussian(random) + (clicks.has(i) ? (spec.clickDb ?? 20) : 0);
  }
  const testDurationS = boundary(n) - boundary(0);
  return { level, offsetsS: spec.jitter ? times : null, trueDuty: openTime / testDurationS, testDurationS };
}

/** Openings of `lengthS` every `everyS`, the first at `firstS`, up to `untilS`. */
export function periodicOpenings(firstS: number, everyS: number, lengthS: number, untilS: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let s = firstS; s + lengthS <= untilS; s += everyS) out.push([s, s + lengthS]);
  return out;
}

/** Tolerance on duty cycle from issue 4: ±0.02 or one sample period ÷ test length, whichever is larger. */
export function dutyTolerance(rateHz: number, testDurationS: number): number {
  return Math.max(0.02, 1 / rateHz / testDurationS);
}

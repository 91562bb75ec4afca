// Synthetic readings of one probe placement: a sound level in dB and a surface temperature
// in °C per sample, shaped so that lib/analysis reads them as the condition they stand for
// (docs/verdict-table.md). The shapes are ours, made for the demo: disc traps snap open and
// shut, buckets discharge in longer gulps, float traps modulate, thermostatic traps run
// subcooled by design, a leaking trap is loud while closed, a blowing one never closes.

import { DEFAULT_PARAMS } from '@/lib/analysis/defaults';
import { designAllowanceK } from '@/lib/analysis/temperature';
import type { TrapType } from '@/lib/analysis/trap-types';
import type { Rng } from './prng';

export const WAVEFORMS = [
  'disc_cycling', 'bucket_cycling', 'thermostatic_cycling', 'steady_condensate', 'modulating', 'quiet_closed',
  'leaking_cycling', 'rapid_cycling', 'blowing', 'cold', 'backing_up', 'noisy_flow', 'pipe_quiet', 'pipe_loud',
] as const;
export type Waveform = (typeof WAVEFORMS)[number];

export interface Readings {
  levelDb: Float64Array;
  temperatureC: Float64Array;
}

export interface SignalSpec {
  waveform: Waveform;
  trapType: TrapType;
  durationS: number;
  rateHz: number;
  /** Saturation temperature of the line, °C (IF97, from the register's pressure). */
  tsatC: number;
  ambientC: number;
  /** For pipe_loud: the trap's mean level the pipe's noise matches. */
  matchDb?: number;
}

/** How long a placement of this shape lasts, s: long enough to see a cycling trap cycle twice. */
export function durationFor(waveform: Waveform, rng: Rng): number {
  switch (waveform) {
    case 'disc_cycling': case 'bucket_cycling': case 'leaking_cycling': return rng.int(24, 45);
    case 'thermostatic_cycling': return rng.int(30, 55);
    case 'rapid_cycling': return rng.int(20, 30);
    case 'steady_condensate': case 'modulating': case 'backing_up': return rng.int(15, 35);
    case 'noisy_flow': return rng.int(20, 30);
    case 'quiet_closed': return rng.int(12, 25);
    case 'blowing': return rng.int(15, 30);
    case 'cold': return rng.int(10, 20);
    case 'pipe_quiet': case 'pipe_loud': return rng.int(10, 15);
  }
}

/** Openings of a cycling trap: start times (s) with a period that wanders ±15 %. */
function openings(durationS: number, periodS: number, openS: number, rng: Rng): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  // The first opening comes after a closed stretch, so a closed interval is seen before it.
  let t = rng.between(Math.min(1.5, periodS / 3), Math.max(1.5, periodS / 2));
  while (t < durationS) {
    const open = openS * rng.between(0.85, 1.15);
    out.push([t, t + open]);
    t += periodS * rng.between(0.85, 1.15);
  }
  return out;
}

type LevelShape = (t: number) => number;

function cycling(spec: SignalSpec, rng: Rng, o: { period: [number, number]; open: [number, number]; openDb: [number, number]; closedDb: [number, number]; snap: boolean }): LevelShape {
  const period = rng.between(...o.period);
  const openDb = rng.between(...o.openDb);
  const closedDb = rng.between(...o.closedDb);
  const ivs = openings(spec.durationS, period, rng.between(...o.open), rng);
  let k = 0;
  return (t) => {
    while (k < ivs.length && t >= ivs[k][1]) k++;
    if (k < ivs.length && t >= ivs[k][0]) {
      const [a, b] = ivs[k];
      // A disc snaps open at full flow and eases as the pressure above it builds; a bucket or a
      // thermostatic element discharges condensate at a steadier level.
      const ease = o.snap ? 5 * ((t - a) / (b - a)) : 1.5 * Math.sin(Math.PI * ((t - a) / (b - a)));
      return openDb - ease + rng.noise(1.5);
    }
    return closedDb + rng.noise(1.5);
  };
}

function steady(rng: Rng, baseDb: [number, number], swingDb: [number, number], noiseDb: number): LevelShape {
  const base = rng.between(...baseDb);
  const swing = rng.between(...swingDb);
  const period = rng.between(8, 20);
  const phase = rng.between(0, 2 * Math.PI);
  return (t) => base + swing * Math.sin((2 * Math.PI * t) / period + phase) + rng.noise(noiseDb);
}

function levelShape(spec: SignalSpec, rng: Rng): LevelShape {
  switch (spec.waveform) {
    case 'disc_cycling':
      return cycling(spec, rng, { period: [7, 14], open: [0.6, 1.6], openDb: [60, 70], closedDb: [11, 17], snap: true });
    case 'bucket_cycling':
      return cycling(spec, rng, { period: [8, 15], open: [1.5, 3.5], openDb: [44, 54], closedDb: [11, 17], snap: false });
    case 'thermostatic_cycling':
      return cycling(spec, rng, { period: [12, 22], open: [3, 7], openDb: [38, 47], closedDb: [10, 16], snap: false });
    case 'leaking_cycling':
      return cycling(spec, rng, { period: [7, 14], open: [0.8, 2.5], openDb: [58, 66], closedDb: [33, 42], snap: spec.trapType === 'thermodynamic_disc' });
    case 'rapid_cycling':
      // Over 60 cycles a minute (NAVFAC MO-209 Table 3-2 calls that a failing disc trap).
      return cycling(spec, rng, { period: [0.7, 0.85], open: [0.3, 0.35], openDb: [60, 66], closedDb: [14, 18], snap: false });
    case 'steady_condensate':
      return steady(rng, [30, 40], [0.5, 1.5], 1.2);
    case 'modulating':
      return steady(rng, [30, 42], [1, 3], 1.5);
    case 'backing_up':
      return steady(rng, [28, 38], [1, 3], 1.5);
    case 'noisy_flow':
      return steady(rng, [40, 48], [0.5, 1.5], 1.5);
    case 'blowing':
      return steady(rng, [63, 74], [0.5, 1.2], 2);
    case 'quiet_closed':
      return steady(rng, [11, 17], [0, 0.5], 1.2);
    case 'cold':
      return steady(rng, [6, 12], [0, 0.3], 1);
    case 'pipe_quiet':
      return steady(rng, [13, 20], [0, 0.5], 1.2);
    case 'pipe_loud': {
      // Noise carried along the line from elsewhere: the pipe is as loud as the trap.
      const m = spec.matchDb ?? 44;
      return steady(rng, [m - 2, m + 2], [0.5, 1.5], 1.5);
    }
  }
}

/** Subcooling a healthy trap of this type shows, K: a few kelvin, plus part of its design subcooling. */
function healthySubcoolingK(type: TrapType, rng: Rng): number {
  const design = designAllowanceK(type, DEFAULT_PARAMS.temperature);
  return design * rng.between(0.4, 0.85) + rng.between(1, 5);
}

/** The surface temperature the shape stands for, °C. */
function surfaceC(spec: SignalSpec, rng: Rng): number {
  switch (spec.waveform) {
    case 'cold':
      return spec.ambientC + rng.between(-2, 9);
    case 'blowing':
      return spec.tsatC - rng.between(0.3, 2.5);
    case 'backing_up': {
      // Beyond the allowance for its type by a clear margin, yet far above ambient: condensate held back.
      const allowance = DEFAULT_PARAMS.temperature.surfaceLossAllowanceK + designAllowanceK(spec.trapType, DEFAULT_PARAMS.temperature);
      return Math.max(spec.ambientC + 30, spec.tsatC - allowance - rng.between(18, 40));
    }
    case 'pipe_quiet': case 'pipe_loud':
      return spec.tsatC - rng.between(1, 4);
    default:
      return spec.tsatC - healthySubcoolingK(spec.trapType, rng);
  }
}

export function synthesise(spec: SignalSpec, rng: Rng): Readings {
  const n = Math.round(spec.durationS * spec.rateHz) + 1;
  const level = levelShape(spec, rng);
  const base = surfaceC(spec, rng);
  const wobble = rng.between(0.2, 0.6);
  const levelDb = new Float64Array(n);
  const temperatureC = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / spec.rateHz;
    levelDb[i] = Math.max(0, level(t));
    temperatureC[i] = base + wobble * Math.sin(t / 6) + rng.noise(0.15);
  }
  return { levelDb, temperatureC };
}

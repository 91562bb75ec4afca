// Which trap is in which condition in which demo survey, and when each placement is made.
// The story (invented, BRIEF §2): most traps work; one area of each site gets worse from one
// spring to the next and another gets better, because the traps that failed there were
// repaired. Each trap's story comes from its own seed (its tag), so it never depends on
// which other traps the register holds.

import { saturationTemperatureAtGaugeC } from '@/lib/analysis/saturated-steam';
import { DEFAULT_PARAMS } from '@/lib/analysis/defaults';
import type { VerdictCode } from '@/lib/analysis/verdict-codes';
import type { Application, TrapStatus, TrapType } from '@/lib/domain/vocabulary';
import { zoneOffsetMs } from '@/lib/import/time-zone';
import { createRng, hashSeed, type Rng } from './prng';
import { durationFor, type Waveform } from './waveforms';

export type DemoSiteCode = 'FV' | 'SM';
export type SurveyPhase = 'first_spring' | 'second_spring' | 'in_progress';
export const SURVEY_PHASES: readonly SurveyPhase[] = ['first_spring', 'second_spring', 'in_progress'];

export interface DemoTrap {
  tag: string;
  site: DemoSiteCode;
  area: string;
  trapType: TrapType;
  application: Application | null;
  pressureBarg: number;
  status: TrapStatus;
}

export interface DemoSurveySpec {
  site: DemoSiteCode;
  phase: SurveyPhase;
  /** First day of the survey, YYYY-MM-DD in the site's zone. */
  startsOn: string;
  timeZone: string;
}

/** What the trap really does in a survey; the analysis should suggest the matching verdict. */
export type Condition = 'working' | 'leaking' | 'rapid_cycling' | 'blowing' | 'cold' | 'backing_up' | 'background_noise';

export const INTENDED_VERDICT: Record<Condition, VerdictCode> = {
  working: 'working', leaking: 'leaking', rapid_cycling: 'leaking', blowing: 'blowing', cold: 'cold',
  backing_up: 'backing_up', background_noise: 'background_noise',
};

export interface Placement {
  waveform: Waveform;
  startedAt: number;
  durationS: number;
  /** Seed of this placement's own readings. */
  seed: number;
}

export interface PlannedTest {
  trap: DemoTrap;
  condition: Condition;
  tsatC: number;
  test: Placement;
  reference: Placement | null;
  /** In the survey in progress: imported by the seed, or left for the demo's day of files. */
  part: 'imported' | 'remaining';
}

type Trend = 'worse' | 'better' | 'steady';

/** The story's areas: one getting worse and one getting better per site. Others hold steady. */
const TRENDS: Record<DemoSiteCode, Record<string, Trend>> = {
  FV: { 'Evaporator Hall': 'worse', 'Spray Dryer': 'better' },
  SM: { 'Line Tracing': 'worse', 'Tank Heating': 'better' },
};

/** Failure rate per survey, and the chance a trap failed in one survey is still failed in the next (not yet repaired). */
const RATES: Record<Trend, { rate: [number, number, number]; keep: number }> = {
  worse: { rate: [0.06, 0.2, 0.26], keep: 0.6 },
  better: { rate: [0.24, 0.07, 0.05], keep: 0.1 },
  steady: { rate: [0.1, 0.1, 0.1], keep: 0.35 },
};

type Failure = Exclude<Condition, 'working' | 'background_noise'>;

/** How each type tends to fail. Float traps modulate, so "leaking" is not a verdict they get (table row 7a). */
const FAILURE_MIX: Record<TrapType, readonly (readonly [Failure, number])[]> = {
  thermodynamic_disc: [['leaking', 45], ['rapid_cycling', 15], ['blowing', 25], ['cold', 10], ['backing_up', 5]],
  inverted_bucket: [['leaking', 40], ['blowing', 35], ['cold', 15], ['backing_up', 10]],
  float_thermostatic: [['blowing', 30], ['backing_up', 35], ['cold', 35]],
  thermostatic_balanced_pressure: [['backing_up', 35], ['blowing', 20], ['cold', 25], ['leaking', 20]],
  thermostatic_bimetallic: [['backing_up', 40], ['cold', 30], ['leaking', 20], ['blowing', 10]],
};

/** How a working trap of each type sounds. */
const WORKING_MIX: Record<TrapType, readonly (readonly [Waveform, number])[]> = {
  thermodynamic_disc: [['disc_cycling', 85], ['quiet_closed', 15]],
  inverted_bucket: [['bucket_cycling', 80], ['quiet_closed', 20]],
  float_thermostatic: [['modulating', 80], ['quiet_closed', 20]],
  thermostatic_balanced_pressure: [['thermostatic_cycling', 45], ['steady_condensate', 35], ['quiet_closed', 20]],
  thermostatic_bimetallic: [['thermostatic_cycling', 40], ['steady_condensate', 40], ['quiet_closed', 20]],
};

const FAILURE_WAVEFORM: Record<Failure, Waveform> = {
  leaking: 'leaking_cycling', rapid_cycling: 'rapid_cycling', blowing: 'blowing', cold: 'cold', backing_up: 'backing_up',
};

/** The trap's condition in each of the three surveys (before any background noise is placed). */
export function trapStory(trap: DemoTrap): [Condition, Condition, Condition] {
  const rng = createRng(hashSeed(trap.tag, 1));
  const trend = TRENDS[trap.site][trap.area] ?? 'steady';
  const { rate, keep } = RATES[trend];
  let mix = FAILURE_MIX[trap.trapType];
  // A disc at 5 Hz shows a sub-second cycle as a handful of samples: rapid cycling only where the meter samples at 10 Hz.
  if (trap.site === 'SM') mix = mix.filter(([f]) => f !== 'rapid_cycling');
  const failure = (): Failure => rng.weighted(mix);
  const story: Condition[] = [];
  let prev: Condition = 'working';
  let prevRate = 0;
  for (let i = 0; i < 3; i++) {
    let now: Condition;
    if (i === 0) now = rng.chance(rate[0]) ? failure() : 'working';
    else if (prev !== 'working') {
      // Not yet repaired: the same fault, a leak sometimes grown into blow-through.
      now = rng.chance(keep) ? (prev === 'leaking' && rng.chance(0.3) ? 'blowing' : prev) : 'working';
    } else {
      const fresh = Math.max(0, (rate[i] - prevRate * keep) / (1 - prevRate));
      now = rng.chance(fresh) ? failure() : 'working';
    }
    story.push(now);
    prev = now;
    prevRate = rate[i];
  }
  return story as [Condition, Condition, Condition];
}

function waveformOf(condition: Condition, trap: DemoTrap, rng: Rng): Waveform {
  if (condition === 'working') return rng.weighted(WORKING_MIX[trap.trapType]);
  if (condition === 'background_noise') return 'noisy_flow';
  return FAILURE_WAVEFORM[condition];
}

/** Share of suspicious traps that get a reference test on the adjacent pipe. */
const REFERENCE_SHARE: Partial<Record<Condition, number>> = { blowing: 0.7, leaking: 0.5, rapid_cycling: 0.3, background_noise: 1 };

const DAY_START_H = 8;
const DAY_END_H = 16.5;
/** Share of the route the survey in progress has covered (BRIEF §2: one survey in progress). */
export const IN_PROGRESS_SHARE = 0.4;

function localMidnightUtc(isoDay: string, zone: string): number {
  const wall = Date.parse(`${isoDay}T00:00:00Z`);
  return wall - zoneOffsetMs(zone, wall - zoneOffsetMs(zone, wall));
}

/** A surveyor's walk through the register: area by area, tag by tag, 08:00–16:30 local, then the next day. */
class Walk {
  private day = 0;
  private t = 0;
  constructor(private readonly spec: DemoSurveySpec, firstDay = 0) {
    this.day = firstDay;
    this.t = this.dayStart();
  }
  private dayStart() {
    const midnight = localMidnightUtc(this.spec.startsOn, this.spec.timeZone) + this.day * 86_400_000;
    return midnight + DAY_START_H * 3_600_000;
  }
  /** Reserves `seconds` of probe time after walking to the next trap; returns the start (UTC ms, whole seconds). */
  next(seconds: number, walkS: number): number {
    let start = Math.round((this.t + walkS * 1000) / 1000) * 1000;
    if (start + seconds * 1000 > this.dayStart() - DAY_START_H * 3_600_000 + DAY_END_H * 3_600_000) {
      this.day++;
      start = this.dayStart();
    }
    this.t = start + seconds * 1000;
    return start;
  }
}

export function tsatOf(trap: DemoTrap): number {
  return saturationTemperatureAtGaugeC(trap.pressureBarg, DEFAULT_PARAMS.pressure.atmosphericKpa);
}

/** Traps of the survey's site in walk order: the register's area order, then tag. */
export function routeOf(traps: readonly DemoTrap[], site: DemoSiteCode): DemoTrap[] {
  const areaOrder = new Map<string, number>();
  for (const t of traps) if (t.site === site && !areaOrder.has(t.area)) areaOrder.set(t.area, areaOrder.size);
  return traps
    .filter((t) => t.site === site && t.status === 'in_service')
    .sort((a, b) => areaOrder.get(a.area)! - areaOrder.get(b.area)! || a.tag.localeCompare(b.tag));
}

/**
 * Every placement of one survey: a trap test per in-service trap (in the survey in progress,
 * the first 40 % of the route imported and the rest left for later), and a reference test on
 * the adjacent pipe for some suspicious traps. One working trap per survey sits beside noise
 * from elsewhere, and its pipe is as loud as it is.
 */
export function planSurvey(traps: readonly DemoTrap[], spec: DemoSurveySpec): PlannedTest[] {
  const phaseIndex = SURVEY_PHASES.indexOf(spec.phase);
  const route = routeOf(traps, spec.site);
  const importedCount = spec.phase === 'in_progress' ? Math.round(route.length * IN_PROGRESS_SHARE) : route.length;
  const conditions = route.map((t) => trapStory(t)[phaseIndex]);
  // The survey's one case of background noise: the working, imported trap whose tag hashes lowest.
  let noisy = -1;
  for (let i = 0; i < importedCount; i++) {
    if (conditions[i] !== 'working') continue;
    if (noisy < 0 || hashSeed(route[i].tag, 7 + phaseIndex) < hashSeed(route[noisy].tag, 7 + phaseIndex)) noisy = i;
  }
  if (noisy >= 0) conditions[noisy] = 'background_noise';

  const walk = new Walk(spec);
  let later: Walk | null = null;
  return route.map((trap, i) => {
    const rng = createRng(hashSeed(trap.tag, 100 + phaseIndex));
    const condition = conditions[i];
    const part = i < importedCount ? 'imported' : 'remaining';
    // The rest of the route in progress is walked from 08:00 on the survey's second day.
    const w = part === 'imported' ? walk : (later ??= new Walk(spec, 1));
    const waveform = waveformOf(condition, trap, rng);
    const durationS = durationFor(waveform, rng);
    const withReference = rng.chance(REFERENCE_SHARE[condition] ?? 0);
    const referenceDurationS = withReference ? durationFor(waveform === 'noisy_flow' ? 'pipe_loud' : 'pipe_quiet', rng) : 0;
    const pauseS = rng.int(12, 30); // moving the probe to the pipe
    const startedAt = w.next(durationS + (withReference ? pauseS + referenceDurationS : 0), rng.int(60, 200));
    const test: Placement = { waveform, startedAt, durationS, seed: hashSeed(trap.tag, 1000 + phaseIndex) };
    const reference: Placement | null = withReference
      ? {
        waveform: waveform === 'noisy_flow' ? 'pipe_loud' : 'pipe_quiet',
        startedAt: startedAt + (durationS + pauseS) * 1000,
        durationS: referenceDurationS,
        seed: hashSeed(trap.tag, 2000 + phaseIndex),
      }
      : null;
    return { trap, condition, tsatC: tsatOf(trap), test, reference, part };
  });
}

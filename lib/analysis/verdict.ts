// The suggested verdict: the decision table of BRIEF §4a, first match wins, written
// out in docs/verdict-table.md. Every row has a test in tests/lib/analysis/verdict.test.ts.
// Where the table is refined, the row says so and why ("Refinement").
//
// Reasons are plain words with the numbers, SI units (the stored text of a verdict).

import type { BandShares, ResolvedBands } from './bands';
import type { AnalysisParams, SeverityMode } from './defaults';
import type { CycleAnalysis } from './intervals';
import type { ReferenceCheck } from './reference-check';
import type { TemperatureAssessment } from './temperature';
import { TRAP_TYPE_WORDS, isCyclingType, isThermostatic, type TrapType } from './trap-types';
import { isFailed, type Confidence, type VerdictCode } from './verdict-codes';

export interface VerdictFacts {
  trapType: TrapType | null;
  outOfService: { register: boolean; fieldNote: boolean };
  cycles: CycleAnalysis;
  bands: ResolvedBands;
  shares: BandShares;
  temperature: TemperatureAssessment;
  reference: ReferenceCheck;
}

export interface SuggestedVerdict {
  code: VerdictCode;
  confidence: Confidence;
  reasons: string[];
  /** The decision-table row that matched (1…9). */
  row: number;
  /** For failures that lose steam: which severity factor the loss estimate uses. */
  lossMode: SeverityMode | null;
  failed: boolean;
}

const db = (v: number) => `${v.toFixed(1)} dB`;
const pct = (share: number) => `${Math.round(share * 100)} %`;
const sec = (v: number) => `${v < 10 ? v.toFixed(1) : Math.round(v)} s`;
const degC = (v: number) => `${v.toFixed(1)} °C`;
const kelvin = (v: number) => `${Math.round(v)} K`;

function typeWords(type: TrapType | null): string {
  return type ? TRAP_TYPE_WORDS[type] : 'trap of unknown type';
}

/** "a disc trap", "an inverted bucket trap": the article the reasons' words need. */
function aTypeWords(type: TrapType | null): string {
  const w = typeWords(type);
  return `${/^[aeiou]/i.test(w) ? 'an' : 'a'} ${w}`;
}

function verdict(
  code: VerdictCode,
  confidence: Confidence,
  row: number,
  reasons: string[],
  lossMode: SeverityMode | null = null,
): SuggestedVerdict {
  return { code, confidence, reasons, row, lossMode, failed: isFailed(code) };
}

function saturationWords(t: TemperatureAssessment): string {
  return `saturation ${degC(t.tsatC!)} at ${t.pressureBarg!.toFixed(1)} barg`;
}

/** Flow present: part of the test above the quiet band, or an opening that rises above it. */
export function isFlowPresent(facts: Pick<VerdictFacts, 'cycles' | 'bands' | 'shares'>, p: AnalysisParams['verdict']): boolean {
  const aboveQuiet = 1 - facts.shares.quiet;
  return aboveQuiet >= p.flowShareMin || facts.cycles.openIntervals.some((iv) => iv.maxDb > facts.bands.quietMaxDb);
}

export function suggestVerdict(facts: VerdictFacts, params: AnalysisParams): SuggestedVerdict {
  const p = params.verdict;
  const { trapType, cycles, bands, shares, temperature: t, reference } = facts;
  const duration = cycles.testDurationS;
  const flow = isFlowPresent(facts, p);
  const openings = cycles.continuousFlow ? 0 : cycles.openIntervals.length;
  const closed = cycles.closedIntervals.length;
  const quietWords = `level in the quiet band (≤ ${db(bands.quietMaxDb)}) ${pct(shares.quiet)} of the time`;
  const longEnough = duration >= p.confidentTestS;

  // Row 1: the line is out of service. Before "cold": an isolated line is cold by necessity.
  if (facts.outOfService.register || facts.outOfService.fieldNote) {
    const reasons = [];
    if (facts.outOfService.register) reasons.push('the register marks the trap out of service');
    if (facts.outOfService.fieldNote) reasons.push('a field note says the line is out of service');
    return verdict('out_of_service', 'high', 1, reasons);
  }

  // Row 2: cold — nearer ambient than saturation, and quiet.
  if (t.cold === true && !flow) {
    const nearAmbient = t.surfaceC! - t.ambientC <= 0.25 * (t.tsatC! - t.ambientC);
    return verdict('cold', nearAmbient ? 'high' : 'medium', 2, [
      `surface ${degC(t.surfaceC!)} is nearer ambient (${degC(t.ambientC)}) than ${saturationWords(t)}`,
      quietWords,
      'blocked, isolated upstream, or the line is off: check that steam is on before replacing the trap',
    ]);
  }

  // Row 3: the reference check. Refinement: only when flow is present — a quiet trap
  // has no sound to attribute to elsewhere, and a quiet pipe beside a quiet, hot trap
  // is the normal closed case (row 8), not a reason to re-check.
  if (flow && reference.available && reference.clearlyLouder === false) {
    return verdict('background_noise', 'medium', 3, [
      `trap ${db(reference.differenceDb! + reference.referenceMeanDb!)} against ${db(reference.referenceMeanDb!)} on the adjacent pipe: ` +
        `only ${db(reference.differenceDb!)} louder, less than the ${db(reference.marginDb)} margin`,
      'the sound may come from elsewhere — re-check, for example with a different frequency band or probe position',
    ]);
  }

  // Row 4: blowing — mostly live steam and never closed.
  if (shares.liveSteam >= p.blowingLiveSteamShare && closed === 0) {
    const reasons = [
      `no closed interval in ${sec(duration)}`,
      `level in the live-steam band (≥ ${db(bands.liveSteamMinDb)}) ${pct(shares.liveSteam)} of the time`,
    ];
    if (trapType && isCyclingType(trapType)) reasons.push(`${aTypeWords(trapType)} should close between discharges`);
    return verdict('blowing', longEnough && shares.liveSteam >= 0.95 ? 'high' : 'medium', 4, reasons, 'blow_through');
  }

  // Row 5: backing up — flowing but well below saturation.
  if (flow && t.beyondAllowance === true) {
    const designK = t.allowanceK - params.temperature.surfaceLossAllowanceK;
    const allowanceWords =
      designK > 0
        ? `${kelvin(t.allowanceK)} allowed for ${aTypeWords(trapType)} (${kelvin(params.temperature.surfaceLossAllowanceK)} surface loss + ${kelvin(designK)} by design)`
        : `${kelvin(t.allowanceK)} allowed for surface loss`;
    // Temperature alone is the least reliable method (NAVFAC MO-209 §2.3.3): high confidence only with a wide margin.
    return verdict('backing_up', t.subcoolingK! > t.allowanceK + 20 ? 'high' : 'medium', 5, [
      `surface ${degC(t.surfaceC!)} is ${kelvin(t.subcoolingK!)} below ${saturationWords(t)}, beyond the ${allowanceWords}`,
      `flow present: level above the quiet band ${pct(1 - shares.quiet)} of the time`,
      'condensate is held back in the line or the equipment',
    ]);
  }

  // Row 6: a cycling trap seen cycling. Refinement: "with closed intervals" read as
  // "open and closed intervals seen" — a test that never opens is quiet throughout and
  // belongs to row 8, which requires the trap to be hot; otherwise a quiet cold-or-
  // unknown disc trap would be called working here.
  if (trapType && isCyclingType(trapType) && openings > 0 && closed > 0) {
    const cycleWords = `${cycles.cyclesPerMinute.toFixed(1)} cycles a minute, open ${pct(cycles.dutyCycle)} of the time`;
    const enoughCycles = openings >= 2 && longEnough;
    if (cycles.meanClosedDb! > bands.quietMaxDb) {
      return verdict('leaking', enoughCycles && cycles.meanClosedDb! >= bands.quietMaxDb + 5 ? 'high' : 'medium', 6, [
        `closed at ${db(cycles.meanClosedDb!)} on average, above the quiet band (≤ ${db(bands.quietMaxDb)})`,
        'a closed trap should be quiet: steam is passing the seat',
        cycleWords,
      ], 'leaking');
    }
    if (trapType === 'thermodynamic_disc' && cycles.cyclesPerMinute > p.discRapidCyclesPerMin) {
      return verdict('leaking', enoughCycles ? 'high' : 'medium', 6, [
        `${cycles.cyclesPerMinute.toFixed(0)} cycles a minute: a disc trap cycling over ${p.discRapidCyclesPerMin} a minute is failing (NAVFAC MO-209)`,
        'rapid cycling',
      ], 'rapid_cycling');
    }
    if (
      trapType === 'inverted_bucket' &&
      cycles.meanCyclePeriodS !== null &&
      cycles.meanCyclePeriodS < p.bucketMinCyclePeriodS
    ) {
      return verdict('leaking', enoughCycles ? 'high' : 'medium', 6, [
        `opens every ${sec(cycles.meanCyclePeriodS)}: an inverted bucket cycling faster than every ${sec(p.bucketMinCyclePeriodS)} is undersized or failing (NAVFAC MO-209)`,
        'rapid cycling',
      ], 'rapid_cycling');
    }
    const reasons = [
      cycleWords,
      `closed at ${db(cycles.meanClosedDb!)} on average, in the quiet band`,
      `${aTypeWords(trapType)} cycles: open, then shut tight`,
    ];
    return verdict('working', enoughCycles && t.cold === false ? 'high' : 'medium', 6, reasons);
  }

  // Row 7: flow with no closed interval. Refinement: a float trap modulates by design
  // and may also close quietly at light load, so any flow short of rows 4–5 is its
  // normal working (its closures are not cycles to be judged).
  if (flow && trapType === 'float_thermostatic') {
    return verdict('working', 'medium', 7, [
      `flow present: level above the quiet band ${pct(1 - shares.quiet)} of the time, live steam ${pct(shares.liveSteam)}`,
      'a float and thermostatic trap discharges continuously, modulating with the load',
    ]);
  }
  if (flow && closed === 0) {
    if (trapType && isThermostatic(trapType) && shares.condensate >= shares.liveSteam) {
      return verdict('working', 'medium', 7, [
        `steady discharge in the condensate band ${pct(shares.condensate)} of the time (live steam ${pct(shares.liveSteam)})`,
        `${aTypeWords(trapType)} may discharge steadily at a steady load`,
      ]);
    }
    if (trapType === 'thermodynamic_disc' || trapType === 'inverted_bucket') {
      if (duration < p.minContinuousTestS) {
        return verdict('inconclusive', 'low', 7, [
          `no closed interval in ${sec(duration)}, shorter than the ${sec(p.minContinuousTestS)} needed to see ${aTypeWords(trapType)} cycle`,
          're-test for longer',
        ]);
      }
      return verdict('leaking', 'medium', 7, [
        `no closed interval in ${sec(duration)}`,
        `level above the quiet band ${pct(1 - shares.quiet)} of the time, live steam ${pct(shares.liveSteam)}`,
        `${aTypeWords(trapType)} cycles: continuous flow means steam is passing`,
      ], 'leaking');
    }
  }

  // Row 8: quiet throughout and hot — closed, and a closed trap is a good trap.
  if (!flow && t.cold === false) {
    return verdict('working', t.beyondAllowance === false ? 'high' : 'medium', 8, [
      quietWords,
      `surface ${degC(t.surfaceC!)} is hot: nearer ${saturationWords(t)} than ambient (${degC(t.ambientC)})`,
      'closed, with steam at the trap',
    ]);
  }

  // Row 9: anything else.
  const reasons: string[] = [];
  if (!flow && t.cold === null) {
    reasons.push(`${quietWords}, but without ${t.surfaceC === null ? 'a surface temperature' : 'a line pressure'} a closed trap cannot be told from a cold one`);
  } else if (!trapType) {
    reasons.push('trap type unknown: the register has none, so the sound cannot be judged against how the trap should behave');
  } else if (isThermostatic(trapType)) {
    reasons.push(`steady flow with live steam ${pct(shares.liveSteam)} of the time, condensate ${pct(shares.condensate)}: neither clearly working nor clearly blowing`);
  } else {
    reasons.push('the readings match no rule of the decision table');
  }
  reasons.push('re-test, and check the trap type and line pressure in the register');
  return verdict('inconclusive', 'low', 9, reasons);
}

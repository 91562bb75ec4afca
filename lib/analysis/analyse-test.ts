// One entry point for the per-test analysis: statistics, intervals, bands,
// temperature, reference check, suggested verdict and, for a trap that loses
// steam, the loss with its cost and CO2. Pure: arrays and parameters in, figures out.
//
// Speed (issue 7: the analysis must stay within ~10 % of import time): every pass
// over the readings is a plain loop over typed arrays, with no object per reading.
// Passes: statistics (2 + selection), smoothing (1, at ≥ 10 Hz), floor (selection per
// block + 1), hysteresis (1), bands (1), interval means (1).

import { bandShares, resolveBands, type BandShares, type ResolvedBands } from './bands';
import { computeBaseline } from './baseline';
import { NO_OVERRIDES, resolveParams, type AnalysisParams, type ParamOverrides } from './defaults';
import { costOfLoss, type LossCost } from './energy-cost';
import { detectCycles, type CycleAnalysis } from './intervals';
import { computeLevelStatistics, type LevelStatistics } from './level-statistics';
import { checkReference, type ReferenceCheck } from './reference-check';
import { smoothLevel } from './smoothing';
import { estimateSteamLoss, type SteamLossEstimate } from './steam-loss';
import { assessTemperature, summariseTemperature, type TemperatureAssessment, type TemperatureSummary } from './temperature';
import { checkTimebase, typicalPeriodS, type Timebase } from './timebase';
import type { TrapType } from './trap-types';
import { suggestVerdict, type SuggestedVerdict } from './verdict';

/** What the register knows about the trap; anything unknown is null. */
export interface TrapFacts {
  type: TrapType | null;
  pressureBarg: number | null;
  sizeDn: number | null;
  orificeMm: number | null;
  /** The register's status is out of service. */
  outOfService: boolean;
}

export interface TestInput {
  timebase: Timebase;
  /** Level readings, dB (after the instrument profile's conversion and offset). */
  levelDb: Float32Array | Float64Array | number[];
  /** Surface temperature readings, °C; non-finite entries are gaps. */
  temperatureC?: ArrayLike<number> | null;
  trap?: Partial<TrapFacts>;
  /** A field note for this trap in this survey says the line is out of service. */
  lineOutOfServiceNote?: boolean;
  /** Mean level of the reference test on the adjacent pipe, dB, when one exists. */
  referenceMeanDb?: number | null;
}

export interface TestAnalysis {
  level: LevelStatistics;
  cycles: CycleAnalysis & { clickRejection: boolean; baselineMode: 'global' | 'rolling'; baselineDb: { min: number; max: number } };
  bands: ResolvedBands & { shares: BandShares };
  temperature: TemperatureAssessment & { summary: TemperatureSummary | null };
  reference: ReferenceCheck;
  verdict: SuggestedVerdict;
  /** Present when the verdict loses steam (blowing, leaking) and the line pressure is known. */
  loss: (SteamLossEstimate & { cost: LossCost }) | null;
  /** Why there is no loss figure for a failed trap, if so. */
  lossNote: string | null;
  /** The parameters actually used, so that a re-run is reproducible. */
  params: AnalysisParams;
}

function toFloat32(values: Float32Array | Float64Array | number[]): Float32Array {
  return values instanceof Float32Array ? values : Float32Array.from(values);
}

type VerdictFacts = Parameters<typeof suggestVerdict>[0];

/**
 * The cheap half of a test's analysis: reference check, suggested verdict and steam loss, from
 * the figures the series gave. analyseTest calls it; the pipeline calls it again when a
 * reference reading of another file becomes known (lib/pipeline/settle.ts), so both agree.
 */
export function judgeTest(
  measured: { meanDb: number } & Pick<VerdictFacts, 'cycles' | 'bands' | 'shares' | 'temperature'>,
  trap: TrapFacts,
  referenceMeanDb: number | null,
  lineOutOfServiceNote: boolean,
  params: AnalysisParams,
): Pick<TestAnalysis, 'reference' | 'verdict' | 'loss' | 'lossNote'> {
  const reference = checkReference(measured.meanDb, referenceMeanDb, params.reference.marginDb);
  const verdict = suggestVerdict(
    {
      trapType: trap.type,
      outOfService: { register: trap.outOfService, fieldNote: lineOutOfServiceNote },
      cycles: measured.cycles,
      bands: measured.bands,
      shares: measured.shares,
      temperature: measured.temperature,
      reference,
    },
    params,
  );
  let loss: TestAnalysis['loss'] = null;
  let lossNote: string | null = null;
  if (verdict.lossMode) {
    if (trap.pressureBarg === null) {
      lossNote = 'no line pressure in the register, so the steam loss cannot be estimated';
    } else {
      const estimate = estimateSteamLoss(
        { pressureBarg: trap.pressureBarg, orificeMm: trap.orificeMm, sizeDn: trap.sizeDn, lossMode: verdict.lossMode },
        params,
      );
      loss = { ...estimate, cost: costOfLoss(estimate.tonnesPerYear, trap.pressureBarg, params) };
    }
  }
  return { reference, verdict, loss, lossNote };
}

export function analyseTest(input: TestInput, overrides: ParamOverrides | AnalysisParams = NO_OVERRIDES): TestAnalysis {
  const params = resolveParams(overrides as ParamOverrides);
  const level = toFloat32(input.levelDb);
  const n = level.length;
  checkTimebase(input.timebase, n);
  const trap: TrapFacts = {
    type: input.trap?.type ?? null,
    pressureBarg: input.trap?.pressureBarg ?? null,
    sizeDn: input.trap?.sizeDn ?? null,
    orificeMm: input.trap?.orificeMm ?? null,
    outOfService: input.trap?.outOfService ?? false,
  };

  const statistics = computeLevelStatistics(level);
  const periodS = typicalPeriodS(input.timebase, n);
  const smoothed = smoothLevel(level, periodS, params.smoothing);
  const baseline = computeBaseline(smoothed.level, input.timebase, params.baseline);
  const bands = resolveBands(trap.type, params.bands);
  const cycles = detectCycles(smoothed.level, baseline.levelDb, input.timebase, bands.quietMaxDb, periodS, params.intervals);
  const shares = bandShares(smoothed.level, input.timebase, bands);

  const temperatureSummary = summariseTemperature(input.temperatureC);
  const temperature = assessTemperature(temperatureSummary?.medianC ?? null, trap.pressureBarg, trap.type, params);
  const { reference, verdict, loss, lossNote } = judgeTest(
    { meanDb: statistics.mean, cycles, bands, shares, temperature },
    trap, input.referenceMeanDb ?? null, input.lineOutOfServiceNote ?? false, params,
  );

  return {
    level: statistics,
    cycles: {
      ...cycles,
      clickRejection: smoothed.clickRejection,
      baselineMode: baseline.mode,
      baselineDb: { min: baseline.minDb, max: baseline.maxDb },
    },
    bands: { ...bands, shares },
    temperature: { ...temperature, summary: temperatureSummary },
    reference,
    verdict,
    loss,
    lossNote,
    params,
  };
}

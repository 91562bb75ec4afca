// Every threshold and factor the analysis uses, with its default and where the
// default comes from. A caller overrides any part with resolveParams(); the
// resolved object is returned with every result so that a re-run with the same
// input and the same parameters gives the same figures.

import type { TrapType } from './trap-types';
import { GJ_PER_MMBTU } from './units';

export interface BandLimits {
  /** Upper edge of the quiet band, dB (quiet = level ≤ this). */
  quietMaxDb: number;
  /** Lower edge of the live-steam band, dB (live steam = level ≥ this). */
  liveSteamMinDb: number;
}

export type SeverityMode = 'blow_through' | 'leaking' | 'rapid_cycling';

export interface EmissionFactor {
  fuel: string;
  /** kg CO2 per GJ of fuel energy (HHV basis when the source is on HHV). */
  kgCo2PerGj: number;
  source: string;
  year: number;
}

export interface AnalysisParams {
  pressure: {
    /** Added to gauge pressure to get absolute pressure. Standard atmosphere, 101.325 kPa (ISO 2533; ASME PTC 39 uses the same 14.696 psia). */
    atmosphericKpa: number;
  };
  smoothing: {
    /**
     * Click rejection (moving median) runs only at or above this sample rate.
     * Below it a sample spans ≥ 0.1 s and one high sample may be a whole real
     * discharge (BRIEF §4a), so nothing is removed. Our default.
     */
    clickRejectionMinRateHz: number;
    /** Odd window of the moving median; 3 removes runs of one sample and keeps runs of two. */
    medianWindowSamples: number;
  };
  baseline: {
    /** 'global': one p10 over the test (BRIEF §4a). 'rolling': a local p10 that follows a drifting floor. */
    mode: 'global' | 'rolling';
    /** Quantile of the smoothed level taken as the floor (BRIEF §4a: 10th percentile). */
    quantile: number;
    /** Rolling mode: the test is cut into blocks of this length and each block's quantile taken. Our default. */
    blockS: number;
    /**
     * Rolling mode: the floor at a block is the lowest block quantile within ± windowS/2,
     * so a block that is open throughout does not lift the floor. Tests shorter than
     * windowS use the global quantile. Our default.
     */
    windowS: number;
  };
  intervals: {
    /** Opens when the smoothed level rises above baseline + this (BRIEF §4a: 8 dB). */
    openAboveBaselineDb: number;
    /** Closes when it falls below baseline + this (BRIEF §4a: 4 dB). */
    closeAboveBaselineDb: number;
    /** Minimum dwell, s; the effective dwell is max(this, one sample period) (BRIEF §4a). */
    minDwellS: number;
    /**
     * Credit a partly open edge sample with the share of its sample period that was
     * open, estimated in the power domain between the floor and the test's open level.
     * Needed at 2 Hz, where a 0.3 s discharge shows as one partial sample. Our method.
     */
    edgeFractions: boolean;
    /**
     * With no transition found, the whole test counts as one open interval (continuous
     * flow) when at least this share of its time lies above the quiet band; otherwise
     * as one closed interval. Our default.
     */
    continuousAboveQuietShare: number;
  };
  bands: {
    /** Lowest precedence: defaults per trap type ('unknown' when the register has none). BRIEF §4a. */
    byTrapType: Record<TrapType | 'unknown', BandLimits>;
    /** Middle precedence: the instrument profile's calibrated limits, if any. */
    profile: Partial<BandLimits> | null;
    /** Highest precedence: a site override, if any. */
    site: Partial<BandLimits> | null;
  };
  temperature: {
    /** Site ambient temperature default (BRIEF §3: 20 °C). */
    ambientC: number;
    /** Subcooling a healthy surface reading may show from heat loss through the wall (BRIEF §4a: 10 K). */
    surfaceLossAllowanceK: number;
    /** Extra subcooling by design, per type (BRIEF §4a: bimetallic 35 K, balanced pressure 15 K). */
    designSubcoolingK: Record<TrapType, number>;
    /** Used when the trap type is unknown: the largest design allowance, so no type is failed for running as designed. */
    unknownTypeDesignSubcoolingK: number;
  };
  reference: {
    /** The trap must be at least this much louder than the adjacent pipe (BRIEF §4a: 6 dB). */
    marginDb: number;
  };
  verdict: {
    /** Row 4: share of test time in the live-steam band for blow-through (BRIEF §4a: 80 %). */
    blowingLiveSteamShare: number;
    /**
     * Flow is present when at least this share of the test lies above the quiet band,
     * or when any open interval rises above it. Otherwise the test is "quiet throughout".
     * Our default: 2 % tolerates a stray noise burst in a quiet test.
     */
    flowShareMin: number;
    /** Row 6: a disc trap cycling more often than this is failing (NAVFAC MO-209 Table 3-2: over 60 times/min). */
    discRapidCyclesPerMin: number;
    /** Row 6: an inverted bucket cycling faster than every this many seconds (NAVFAC MO-209 Table 3-2: 5 s). */
    bucketMinCyclePeriodS: number;
    /** Row 7: continuous flow in a disc or bucket trap is judged only on tests at least this long (BRIEF §4a: 20 s). */
    minContinuousTestS: number;
    /** A test at least this long with two or more cycles is long enough for high confidence (two disc cycles at ~10 s, MO-209). Our default. */
    confidentTestS: number;
  };
  loss: {
    /**
     * Discharge coefficient against Napier's theoretical P·A/70 rule. 0.60 reproduces the
     * practical 24.24 lb/h per psia·in² form (24.24 / 40.392 = 0.600, see
     * shared/references/trade-references.md §1.1–1.2). Shown to the user.
     */
    dischargeCoefficient: number;
    /** Name of the convention the coefficient belongs to, carried with every figure. */
    convention: string;
    /** Loss fraction by failure mode (BRIEF §4a, from UN CDM AM0017 via a secondary source). */
    severity: Record<SeverityMode, number>;
    /** Orifice when the register has none, by connection size (BRIEF §4a: our defaults, from memory). */
    defaultOrificeByDn: Array<{ maxDn: number; orificeMm: number }>;
    /** Orifice for sizes above the last entry, and for an unknown size (our default, from memory). */
    defaultOrificeLargerMm: number;
    /** BRIEF §3: default operating hours per year. */
    operatingHoursPerYear: number;
  };
  cost: {
    /** Feedwater temperature, °C. 105 °C is a typical deaerator outlet (common practice, no source). */
    feedwaterC: number;
    /** Boiler efficiency on the fuel's heating-value basis. 0.857: natural gas, DOE Steam Tip Sheet #15 Table 2 (later sheet). */
    boilerEfficiency: number;
    /** Price of steam per tonne, in the site currency; used when set. */
    steamPricePerTonne: number | null;
    /** Price of fuel per GJ, in the site currency; used when no steam price is set. */
    fuelPricePerGj: number | null;
    currency: string | null;
    emissionFactor: EmissionFactor;
  };
}

/** EPA 40 CFR Part 98 Subpart C, Table C-1, kg CO2/mmBtu (HHV), as amended 81 FR 89188 (9 Dec 2016). */
export const EPA_TABLE_C1_KG_PER_MMBTU = {
  natural_gas: 53.06,
  distillate_fuel_oil_no2: 73.96,
  bituminous_coal: 93.28,
} as const;

export function epaEmissionFactor(fuel: keyof typeof EPA_TABLE_C1_KG_PER_MMBTU): EmissionFactor {
  return {
    fuel,
    kgCo2PerGj: EPA_TABLE_C1_KG_PER_MMBTU[fuel] / GJ_PER_MMBTU,
    source: 'EPA 40 CFR Part 98 Subpart C, Table C-1 (81 FR 89188)',
    year: 2016,
  };
}

const STANDARD_BANDS: BandLimits = { quietMaxDb: 25, liveSteamMinDb: 52 };

export const DEFAULT_PARAMS: AnalysisParams = {
  pressure: { atmosphericKpa: 101.325 },
  smoothing: { clickRejectionMinRateHz: 10, medianWindowSamples: 3 },
  baseline: { mode: 'rolling', quantile: 0.1, blockS: 5, windowS: 30 },
  intervals: {
    openAboveBaselineDb: 8,
    closeAboveBaselineDb: 4,
    minDwellS: 0.2,
    edgeFractions: true,
    continuousAboveQuietShare: 0.5,
  },
  bands: {
    byTrapType: {
      thermodynamic_disc: { ...STANDARD_BANDS },
      thermostatic_balanced_pressure: { ...STANDARD_BANDS },
      thermostatic_bimetallic: { ...STANDARD_BANDS },
      float_thermostatic: { ...STANDARD_BANDS },
      inverted_bucket: { ...STANDARD_BANDS },
      unknown: { ...STANDARD_BANDS },
    },
    profile: null,
    site: null,
  },
  temperature: {
    ambientC: 20,
    surfaceLossAllowanceK: 10,
    designSubcoolingK: {
      thermodynamic_disc: 0,
      thermostatic_balanced_pressure: 15,
      thermostatic_bimetallic: 35,
      float_thermostatic: 0,
      inverted_bucket: 0,
    },
    unknownTypeDesignSubcoolingK: 35,
  },
  reference: { marginDb: 6 },
  verdict: {
    blowingLiveSteamShare: 0.8,
    flowShareMin: 0.02,
    discRapidCyclesPerMin: 60,
    bucketMinCyclePeriodS: 5,
    minContinuousTestS: 20,
    confidentTestS: 20,
  },
  loss: {
    dischargeCoefficient: 0.6,
    convention: 'Napier with discharge coefficient (0.60 = the 24.24 lb/h per psia·in² practical form)',
    severity: { blow_through: 1.0, leaking: 0.25, rapid_cycling: 0.2 },
    defaultOrificeByDn: [
      { maxDn: 15, orificeMm: 3.2 },
      { maxDn: 20, orificeMm: 4.8 },
      { maxDn: 25, orificeMm: 6.4 },
    ],
    defaultOrificeLargerMm: 9.5,
    operatingHoursPerYear: 8000,
  },
  cost: {
    feedwaterC: 105,
    boilerEfficiency: 0.857,
    steamPricePerTonne: null,
    fuelPricePerGj: null,
    currency: null,
    emissionFactor: epaEmissionFactor('natural_gas'),
  },
};

export type DeepPartial<T> = T extends Array<infer _U>
  ? T
  : T extends object
    ? { [K in keyof T]?: DeepPartial<T[K]> | null }
    : T;

export type ParamOverrides = DeepPartial<AnalysisParams>;

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value) && !ArrayBuffer.isView(value);
}

// Objects merge key by key; arrays and scalars replace; undefined (or null in
// place of a whole section) leaves the default.
function merge(base: unknown, override: unknown): unknown {
  if (override === undefined || (override === null && isPlainObject(base))) return structuredClone(base);
  if (isPlainObject(base) && isPlainObject(override)) {
    const out: Record<string, unknown> = {};
    for (const key of new Set([...Object.keys(base), ...Object.keys(override)])) {
      out[key] = merge(base[key], override[key]);
    }
    return out;
  }
  return structuredClone(override);
}

function requireRange(name: string, value: number, min: number, max: number): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new RangeError(`${name} must be between ${min} and ${max}, got ${value}`);
  }
}

function validate(p: AnalysisParams): void {
  requireRange('pressure.atmosphericKpa', p.pressure.atmosphericKpa, 50, 110);
  requireRange('baseline.quantile', p.baseline.quantile, 0, 1);
  if (p.smoothing.medianWindowSamples % 2 !== 1 || p.smoothing.medianWindowSamples < 1) {
    throw new RangeError('smoothing.medianWindowSamples must be an odd whole number');
  }
  if (!(p.intervals.openAboveBaselineDb > p.intervals.closeAboveBaselineDb)) {
    throw new RangeError('intervals: the open limit must lie above the close limit (hysteresis)');
  }
  requireRange('intervals.minDwellS', p.intervals.minDwellS, 0, 60);
  requireRange('loss.dischargeCoefficient', p.loss.dischargeCoefficient, 0, 1.2);
  requireRange('cost.boilerEfficiency', p.cost.boilerEfficiency, 0.05, 1);
  requireRange('loss.operatingHoursPerYear', p.loss.operatingHoursPerYear, 0, 8784);
  for (const [mode, factor] of Object.entries(p.loss.severity)) requireRange(`loss.severity.${mode}`, factor, 0, 1);
}

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

/** No overrides: the defaults as they are. */
export const NO_OVERRIDES: ParamOverrides = Object.freeze({});

// An import analyses every test of a file with the same overrides: merging and validating them
// once per overrides object, not once per test, saves a deep copy per test. The result is
// frozen, so sharing it is safe.
const resolved = new WeakMap<object, AnalysisParams>();

/** Defaults with the given overrides applied, validated and frozen. Never mutates DEFAULT_PARAMS. */
export function resolveParams(overrides: ParamOverrides = NO_OVERRIDES): AnalysisParams {
  const known = resolved.get(overrides);
  if (known) return known;
  const params = merge(DEFAULT_PARAMS, overrides) as AnalysisParams;
  validate(params);
  resolved.set(overrides, deepFreeze(params));
  return params;
}

// Steam lost through a failed trap's orifice, by Napier's rule for choked flow of
// dry saturated steam: W [lb/s] = P [psia] · A [in²] / 70 (trade-references §1.1,
// [memory] for the statement of the rule), times a discharge coefficient Cd, times a
// separate severity factor for how far the trap has failed.
//
// Conventions (never mixed in one figure; each estimate names the one it used):
//  - practical_24_24: Cd 0.60, the 24.24 lb/h per psia·in² form common in energy-audit
//    literature (24.24 / 40.392 = 0.600; trade-references §1.1–1.2). Our default.
//  - doe_tip_sheet_1: Cd 0.7292, the coefficient implied by the table of DOE Steam Tip
//    Sheet #1 "Inspect and Repair Steam Traps" (75.8 lb/h at 150 psig through 1/8 in:
//    75.8 / (40.392 × 164.696 × 1/64) = 0.7292 [computed from a read cell]).

import type { AnalysisParams, SeverityMode } from './defaults';
import { KG_PER_LB, PA_PER_PSI } from './units';

/** Napier's constant in SI: kg/s per (Pa · m²) = (1/70 lb/s) / (1 psi · 1 in²). */
export const NAPIER_KG_PER_S_PER_PA_M2 = KG_PER_LB / 70 / (PA_PER_PSI * 0.0254 * 0.0254);

export const NAPIER_CONVENTIONS = {
  practical_24_24: {
    dischargeCoefficient: 0.6,
    label: 'Napier with discharge coefficient (0.60 = the 24.24 lb/h per psia·in² practical form)',
  },
  doe_tip_sheet_1: {
    dischargeCoefficient: 0.7292,
    label: 'Napier with discharge coefficient 0.7292, as implied by the DOE Steam Tip Sheet #1 table',
  },
} as const;

export type OrificeSource = 'register' | 'default_by_size' | 'default_unknown_size';

export interface SteamLossEstimate {
  lossMode: SeverityMode;
  pressureBarg: number;
  absolutePressureKpa: number;
  orificeMm: number;
  orificeSource: OrificeSource;
  dischargeCoefficient: number;
  convention: string;
  severityFactor: number;
  /** Napier flow through the full orifice with the discharge coefficient, before the severity factor. */
  fullOrificeKgPerHour: number;
  kgPerHour: number;
  operatingHoursPerYear: number;
  tonnesPerYear: number;
}

/** Napier flow with a discharge coefficient, kg/h, for absolute pressure in kPa and orifice diameter in mm. */
export function napierFlowKgPerHour(absolutePressureKpa: number, orificeMm: number, dischargeCoefficient: number): number {
  const areaM2 = (Math.PI / 4) * (orificeMm / 1000) ** 2;
  return dischargeCoefficient * NAPIER_KG_PER_S_PER_PA_M2 * absolutePressureKpa * 1000 * areaM2 * 3600;
}

export function defaultOrifice(sizeDn: number | null, p: AnalysisParams['loss']): { orificeMm: number; source: OrificeSource } {
  if (sizeDn === null || !Number.isFinite(sizeDn)) {
    // Unknown size: the smallest default, so an unknown trap is never costed high.
    const smallest = p.defaultOrificeByDn[0]?.orificeMm ?? p.defaultOrificeLargerMm;
    return { orificeMm: smallest, source: 'default_unknown_size' };
  }
  const entry = p.defaultOrificeByDn.find((e) => sizeDn <= e.maxDn);
  return { orificeMm: entry ? entry.orificeMm : p.defaultOrificeLargerMm, source: 'default_by_size' };
}

export interface SteamLossInput {
  pressureBarg: number;
  orificeMm: number | null;
  sizeDn: number | null;
  lossMode: SeverityMode;
}

export function estimateSteamLoss(input: SteamLossInput, params: AnalysisParams): SteamLossEstimate {
  const p = params.loss;
  if (!(input.pressureBarg >= 0) || !Number.isFinite(input.pressureBarg)) {
    throw new RangeError(`line pressure must be a gauge pressure ≥ 0, got ${input.pressureBarg}`);
  }
  const fromRegister = input.orificeMm !== null && Number.isFinite(input.orificeMm) && input.orificeMm > 0;
  const orifice = fromRegister
    ? { orificeMm: input.orificeMm as number, source: 'register' as const }
    : defaultOrifice(input.sizeDn, p);
  const absolutePressureKpa = input.pressureBarg * 100 + params.pressure.atmosphericKpa;
  const fullOrificeKgPerHour = napierFlowKgPerHour(absolutePressureKpa, orifice.orificeMm, p.dischargeCoefficient);
  const severityFactor = p.severity[input.lossMode];
  const kgPerHour = fullOrificeKgPerHour * severityFactor;
  return {
    lossMode: input.lossMode,
    pressureBarg: input.pressureBarg,
    absolutePressureKpa,
    orificeMm: orifice.orificeMm,
    orificeSource: orifice.source,
    dischargeCoefficient: p.dischargeCoefficient,
    convention: p.convention,
    severityFactor,
    fullOrificeKgPerHour,
    kgPerHour,
    operatingHoursPerYear: p.operatingHoursPerYear,
    tonnesPerYear: (kgPerHour * p.operatingHoursPerYear) / 1000,
  };
}

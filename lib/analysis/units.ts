// SI inside; these helpers convert and format figures for display in SI or US
// customary units. Exact conversion constants:
//  - 1 lb = 0.45359237 kg (international yard and pound, 1959);
//  - 1 in = 25.4 mm (same agreement);
//  - 1 psi = 1 lbf/in² = 0.45359237 × 9.80665 N / (0.0254 m)² = 6894.757293168… Pa;
//  - 1 Btu (International Table) = 1055.05585262 J, so 1 Btu/lb = 2.326 kJ/kg exactly;
//  - °F = °C × 9/5 + 32; a temperature difference of 1 K = 1.8 °F.

import type { UnitSystem } from '../domain/vocabulary';

export type { UnitSystem };

export const KG_PER_LB = 0.45359237;
export const MM_PER_IN = 25.4;
export const PA_PER_PSI = (KG_PER_LB * 9.80665) / (0.0254 * 0.0254);
export const KJ_PER_BTU = 1.05505585262;
export const KJ_PER_KG_PER_BTU_PER_LB = 2.326;
export const GJ_PER_MMBTU = 1.05505585262;

export const kgToLb = (kg: number): number => kg / KG_PER_LB;
export const lbToKg = (lb: number): number => lb * KG_PER_LB;
export const celsiusToFahrenheit = (c: number): number => (c * 9) / 5 + 32;
export const fahrenheitToCelsius = (f: number): number => ((f - 32) * 5) / 9;
export const kelvinDifferenceToFahrenheit = (k: number): number => k * 1.8;
export const barToPsi = (bar: number): number => (bar * 1e5) / PA_PER_PSI;
export const psiToBar = (psi: number): number => (psi * PA_PER_PSI) / 1e5;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const inToMm = (inch: number): number => inch * MM_PER_IN;
export const kjPerKgToBtuPerLb = (kjPerKg: number): number => kjPerKg / KJ_PER_KG_PER_BTU_PER_LB;
export const btuPerLbToKjPerKg = (btuPerLb: number): number => btuPerLb * KJ_PER_KG_PER_BTU_PER_LB;
/** Tonnes per year to thousands of pounds per year. */
export const tonnesToKlb = (t: number): number => (t * 1000) / KG_PER_LB / 1000;
export const klbToTonnes = (klb: number): number => (klb * 1000 * KG_PER_LB) / 1000;
export const gjToMmbtu = (gj: number): number => gj / GJ_PER_MMBTU;
export const mmbtuToGj = (mmbtu: number): number => mmbtu * GJ_PER_MMBTU;

/** What a figure measures; decides its unit in each system. Values passed in are always SI. */
export type QuantityKind =
  | 'massFlow' // kg/h | lb/h
  | 'annualMass' // t/yr | klb/yr
  | 'temperature' // °C | °F
  | 'temperatureDifference' // K | °F
  | 'gaugePressure' // barg | psig
  | 'length' // mm | in
  | 'energy' // GJ | MMBtu
  | 'specificEnthalpy' // kJ/kg | Btu/lb
  | 'level'; // dB in both

const CONVERSIONS: Record<QuantityKind, { si: string; us: string; toUs: (v: number) => number; digits: number }> = {
  massFlow: { si: 'kg/h', us: 'lb/h', toUs: kgToLb, digits: 1 },
  annualMass: { si: 't/yr', us: 'klb/yr', toUs: tonnesToKlb, digits: 1 },
  temperature: { si: '°C', us: '°F', toUs: celsiusToFahrenheit, digits: 1 },
  temperatureDifference: { si: 'K', us: '°F', toUs: kelvinDifferenceToFahrenheit, digits: 1 },
  gaugePressure: { si: 'barg', us: 'psig', toUs: barToPsi, digits: 1 },
  length: { si: 'mm', us: 'in', toUs: mmToIn, digits: 2 },
  energy: { si: 'GJ', us: 'MMBtu', toUs: gjToMmbtu, digits: 1 },
  specificEnthalpy: { si: 'kJ/kg', us: 'Btu/lb', toUs: kjPerKgToBtuPerLb, digits: 1 },
  level: { si: 'dB', us: 'dB', toUs: (v) => v, digits: 1 },
};

export interface FormattedFigure {
  value: number;
  unit: string;
  text: string;
}

/** Converts an SI value to the chosen system and formats it ("12.3 kg/h"); digits default per kind. */
export function formatFigure(
  valueSi: number,
  kind: QuantityKind,
  system: UnitSystem,
  digits = CONVERSIONS[kind].digits,
): FormattedFigure {
  const c = CONVERSIONS[kind];
  const value = system === 'us' ? c.toUs(valueSi) : valueSi;
  const unit = system === 'us' ? c.us : c.si;
  const number = Number.isFinite(value)
    ? value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })
    : '—';
  return { value, unit, text: `${number} ${unit}` };
}

// Figures as the report prints them, in the site's unit system (lib/analysis/units.ts converts;
// values arrive in SI). CO2 stays in metric tonnes in both systems: emission inventories are kept
// in metric tonnes whichever units the plant works in.
import { formatFigure, kgToLb, mmToIn, tonnesToKlb, type UnitSystem } from '@/lib/analysis/units';

export const decimal = (v: number, digits: number) => v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

export const percent = (rate: number | null) => (rate === null ? '—' : `${decimal(rate * 100, 1)} %`);
export const count = (n: number) => decimal(n, 0);
export const flow = (kgPerHour: number, system: UnitSystem) => formatFigure(kgPerHour, 'massFlow', system).text;
export const annual = (tonnesPerYear: number, system: UnitSystem) => formatFigure(tonnesPerYear, 'annualMass', system).text;
export const money = (value: number | null, currency: string, digits = 0) => (value === null ? 'not priced' : `${decimal(value, digits)} ${currency}`);
export const co2 = (tonnes: number) => `${decimal(tonnes, 1)} t CO2/yr`;
export const length = (mm: number, system: UnitSystem) => formatFigure(mm, 'length', system).text;
export const temperature = (c: number, system: UnitSystem) => formatFigure(c, 'temperature', system).text;

/** Column units and converters for tables that keep numbers as numbers (spreadsheet, CSV). */
export function tableUnits(system: UnitSystem) {
  return system === 'us'
    ? { flow: 'lb/h', annual: 'klb/yr', length: 'in', toFlow: kgToLb, toAnnual: tonnesToKlb, toLength: mmToIn }
    : { flow: 'kg/h', annual: 't/yr', length: 'mm', toFlow: (v: number) => v, toAnnual: (v: number) => v, toLength: (mm: number) => mm };
}

// "Method and parameters": how the figures were made, with the sources of the factors, in the
// words the PDF and the spreadsheet both print. The basis is the one stored with the figures, so
// a published report names the settings it was published with.
import { VERDICT_LABELS, FAILED_VERDICTS } from '@/lib/analysis/verdict-codes';
import { dateInZone, type ReportData } from './report-data';
import { count, money, temperature } from './format';

export const DECISION_TABLE_REFERENCE = 'docs/verdict-table.md';

const FUEL_WORDS: Record<string, string> = {
  natural_gas: 'natural gas',
  distillate_fuel_oil_no2: 'distillate fuel oil no. 2',
  bituminous_coal: 'bituminous coal',
  other: 'other fuel',
};

const SEVERITY_WORDS: Record<string, string> = { blow_through: 'blowing', leaking: 'leaking', rapid_cycling: 'rapid cycling' };

export type MethodLine = { label: string; value: string };

export function methodLines(data: ReportData): MethodLine[] {
  const { basis } = data.figures;
  const { cost } = basis;
  const system = data.site.unitSystem;
  const currency = cost.currency ?? data.settings.currency;
  const severities = Object.entries(basis.severity).map(([mode, share]) => `${SEVERITY_WORDS[mode] ?? mode} ${share.toFixed(2)}`).join(', ');
  const costBasis = cost.steamPricePerTonne !== null
    ? `steam priced at ${money(cost.steamPricePerTonne, currency, 2)} per tonne`
    : cost.fuelPricePerGj !== null
      ? `fuel priced at ${money(cost.fuelPricePerGj, currency, 2)} per GJ, boiler efficiency ${(cost.boilerEfficiency * 100).toFixed(1)} %, feedwater ${temperature(cost.feedwaterC, system)}; steam energy from IF97 enthalpies (saturated steam at line pressure minus feedwater)`
      : 'no steam or fuel price set: costs are not computed';
  const factor = cost.emissionFactor;
  const failed = [...FAILED_VERDICTS].map((v) => VERDICT_LABELS[v]).join(', ');
  return [
    {
      label: 'Figures',
      value: data.frozen && data.survey.publishedAt
        ? `frozen at publication on ${dateInZone(data.survey.publishedAt, data.site.timeZone)}, with the settings of that day`
        : `draft, computed on ${dateInZone(data.generatedAt, data.site.timeZone)} from the current settings; they change when the settings or verdicts do`,
    },
    { label: 'Verdicts', value: `suggested by the decision table in ${DECISION_TABLE_REFERENCE} (first matching row wins), then confirmed or overridden by an analyst` },
    { label: 'Failed', value: `${failed}; failure rate = failed ÷ tested traps in service` },
    { label: 'Steam loss', value: `${basis.convention}; coefficient used: ${basis.dischargeCoefficient.toFixed(2)}` },
    { label: 'Severity', value: `share of a full orifice's flow: ${severities} (loss fractions as in UN CDM methodology AM0017, secondary source)` },
    { label: 'Operating hours', value: `${count(basis.operatingHoursPerYear)} h per year` },
    { label: 'Cost basis', value: costBasis },
    {
      label: 'CO2 factor',
      value: `${FUEL_WORDS[factor.fuel] ?? factor.fuel}, ${factor.kgCo2PerGj.toFixed(2)} kg CO2 per GJ of fuel; source: ${factor.source}, ${factor.year}`,
    },
    { label: 'Units', value: system === 'us' ? 'US customary (lb/h, klb/yr, psig, °F); CO2 in metric tonnes' : 'SI (kg/h, t/yr, barg, °C)' },
  ];
}

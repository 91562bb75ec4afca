// The report's tables as columns and rows of plain values, for the spreadsheet and the CSV alike:
// numbers stay numbers (converted to the site's units, the unit in the column's name), text is
// text. The builders neutralise text cells on the way out.
import { VERDICT_LABELS } from '@/lib/analysis/verdict-codes';
import { tableUnits } from './format';
import { methodLines } from './method';
import { statusLine, type ReportData } from './report-data';

export type ColumnKind = 'text' | 'int' | 'fraction' | 'decimal1' | 'decimal2' | 'money';
export type Column = { header: string; kind: ColumnKind; width: number };
export type Table = { columns: Column[]; rows: (string | number | null)[][] };

const ORIFICE_WORDS: Record<string, string> = {
  register: 'register',
  default_by_size: 'default for its size',
  default_unknown_size: 'default, size unknown',
};

const col = (header: string, kind: ColumnKind, width = kind === 'text' ? 18 : 14): Column => ({ header, kind, width });

export function summaryTable(data: ReportData): Table {
  const u = tableUnits(data.site.unitSystem);
  const t = data.figures.total;
  const currency = data.settings.currency;
  const rows: (string | number | null)[][] = [
    ['Site', `${data.site.name} (${data.site.code})`],
    ['Survey', data.survey.name],
    ['Survey dates', `${data.survey.startsOn} to ${data.survey.endsOn}`],
    ['Status', statusLine(data)],
    ['Registered traps', t.registered],
    ['In service', t.inService],
    ['Tested', t.tested],
    ['Not tested', t.untested],
    ['Failed', t.failed],
    ['Failure rate', t.failureRate],
    ['Verdicts confirmed by an analyst', t.decided],
    ['Re-test pending', t.retestPending],
    [`Steam lost (${u.flow})`, u.toFlow(t.lossKgPerHour)],
    [`Steam lost (${u.annual})`, u.toAnnual(t.lossTonnesPerYear)],
    [`Cost per year (${currency})`, t.costPerYear],
    ['CO2 per year (t)', t.co2TonnesPerYear],
    ...Object.entries(t.verdicts).map(([code, n]) => [`Verdict: ${VERDICT_LABELS[code as keyof typeof VERDICT_LABELS]}`, n]),
  ];
  return { columns: [col('Figure', 'text', 36), col('Value', 'text', 44)], rows };
}

/** Kind of each summary value, by row label; the Value column mixes text and numbers. */
export function summaryKind(label: string): ColumnKind {
  if (label === 'Failure rate') return 'fraction';
  if (label.startsWith('Steam lost') || label.startsWith('CO2')) return 'decimal1';
  if (label.startsWith('Cost')) return 'money';
  return 'int';
}

export function areaTable(data: ReportData): Table {
  const u = tableUnits(data.site.unitSystem);
  const currency = data.settings.currency;
  return {
    columns: [
      col('Area', 'text', 24), col('Registered', 'int', 11), col('In service', 'int', 11), col('Tested', 'int', 9), col('Not tested', 'int', 11),
      col('Failed', 'int', 9), col('Failure rate', 'fraction', 12), col(`Steam lost (${u.flow})`, 'decimal1'), col(`Steam lost (${u.annual})`, 'decimal1'),
      col(`Cost per year (${currency})`, 'money', 18), col('CO2 per year (t)', 'decimal1'),
    ],
    rows: data.figures.byArea.map((a) => [
      a.areaName, a.registered, a.inService, a.tested, a.untested, a.failed, a.failureRate, u.toFlow(a.lossKgPerHour), u.toAnnual(a.lossTonnesPerYear),
      a.costPerYear, a.co2TonnesPerYear,
    ]),
  };
}

export function failureTable(data: ReportData): Table {
  const u = tableUnits(data.site.unitSystem);
  const currency = data.settings.currency;
  return {
    columns: [
      col('Rank', 'int', 7), col('Tag', 'text', 16), col('Area', 'text', 22), col('Verdict', 'text', 22), col('Confirmed', 'text', 11), col('Criticality', 'text', 11),
      col(`Steam lost (${u.flow})`, 'decimal1'), col(`Steam lost (${u.annual})`, 'decimal1'), col(`Cost per year (${currency})`, 'money', 18),
      col('CO2 per year (t)', 'decimal1'), col(`Orifice (${u.length})`, 'decimal2', 12), col('Orifice from', 'text', 14),
    ],
    rows: data.figures.failures.map((f, i) => [
      i + 1, f.tag, f.areaName ?? 'No area', VERDICT_LABELS[f.verdict], f.decided ? 'yes' : 'suggested', f.criticality,
      u.toFlow(f.kgPerHour), u.toAnnual(f.tonnesPerYear), f.costPerYear, f.co2TonnesPerYear, u.toLength(f.orificeMm), ORIFICE_WORDS[f.orificeSource] ?? f.orificeSource,
    ]),
  };
}

export function trendTable(data: ReportData): Table {
  const u = tableUnits(data.site.unitSystem);
  const currency = data.settings.currency;
  const columns = [
    col('Survey', 'text', 26), col('Starts on', 'text', 12), col('Area', 'text', 22), col('Tested', 'int', 9), col('Failed', 'int', 9),
    col('Failure rate', 'fraction', 12), col(`Steam lost (${u.flow})`, 'decimal1'), col(`Cost per year (${currency})`, 'money', 18), col('Figures', 'text', 12),
  ];
  const rows: (string | number | null)[][] = [];
  data.trends.surveys.forEach((s, i) => {
    const state = s.frozen ? 'published' : 'draft';
    rows.push([s.name, s.startsOn, 'All areas', s.tested, s.failed, s.failureRate, u.toFlow(s.lossKgPerHour), s.costPerYear, state]);
    for (const a of data.trends.areas) {
      const x = a.bySurvey[i];
      if (x) rows.push([s.name, s.startsOn, a.areaName, x.tested, x.failed, x.failureRate, u.toFlow(x.lossKgPerHour), x.costPerYear, state]);
    }
  });
  return { columns, rows };
}

export function methodTable(data: ReportData): Table {
  return { columns: [col('Parameter', 'text', 20), col('Value', 'text', 110)], rows: methodLines(data).map((m) => [m.label, m.value]) };
}

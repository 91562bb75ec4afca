// The CSV exports: the costliest failures (the table a maintenance planner works from) or the
// figures by area. A CSV has no page to print a note on, so each row names its survey and the
// status line (draft, or published with its date); the file name says it too.
import { toCsv } from './csv';
import { statusLine, type CsvTable, type ReportData } from './report-data';
import { areaTable, failureTable, type ColumnKind } from './tables';

// Decimals kept per kind of column: enough for any sum a reader makes, without float noise.
const DECIMALS: Record<ColumnKind, number | null> = { text: null, int: 0, fraction: 4, decimal1: 2, decimal2: 3, money: 2 };

const rounded = (value: string | number | null, kind: ColumnKind) => {
  const digits = DECIMALS[kind];
  return typeof value === 'number' && digits !== null ? Number(value.toFixed(digits)) : value;
};

export function buildReportCsv(data: ReportData, table: CsvTable = 'failures'): Uint8Array {
  const t = table === 'areas' ? areaTable(data) : failureTable(data);
  const status = statusLine(data);
  const header = [...t.columns.map((c) => c.header), 'Survey', 'Status'];
  const rows = t.rows.map((r) => [...r.map((v, i) => rounded(v, t.columns[i].kind)), data.survey.name, status]);
  return new TextEncoder().encode(toCsv(header, rows));
}

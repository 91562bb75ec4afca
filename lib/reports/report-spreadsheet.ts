// The spreadsheet: one sheet per table (Summary, By area, Failures, Trends, Method). Numbers are
// written as numbers with a number format; every text cell goes through neutraliseCell. Each
// sheet's second row, and its printed header, carries the status line (draft or published).
import ExcelJS from 'exceljs';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TITLE } from './cautions';
import { neutraliseCell } from './neutralise';
import { statusLine, type ReportData } from './report-data';
import { areaTable, failureTable, methodTable, summaryKind, summaryTable, trendTable, type ColumnKind, type Table } from './tables';

const NUMBER_FORMATS: Record<Exclude<ColumnKind, 'text'>, string> = {
  int: '#,##0',
  fraction: '0.0%',
  decimal1: '#,##0.0',
  decimal2: '#,##0.00',
  money: '#,##0',
};
const ACCENT = 'FF137067';

function titleRows(ws: ExcelJS.Worksheet, data: ReportData, title: string) {
  const status = statusLine(data);
  ws.addRow([neutraliseCell(`${title} — ${data.survey.name}, ${data.site.name}`)]).font = { bold: true, size: 13, color: { argb: ACCENT } };
  ws.addRow([neutraliseCell(status)]).font = { italic: true };
  ws.addRow([]);
  // Printed pages carry it too (&& escapes the header's own codes).
  ws.headerFooter.oddHeader = `&L${status.replace(/&/g, '&&')}&RPage &P of &N`;
}

function setCell(cell: ExcelJS.Cell, value: string | number | null, kind: ColumnKind) {
  const v = neutraliseCell(value);
  cell.value = v;
  if (typeof v === 'number' && kind !== 'text') cell.numFmt = NUMBER_FORMATS[kind];
}

function addTable(ws: ExcelJS.Worksheet, table: Table, kindOf?: (row: (string | number | null)[]) => ColumnKind) {
  const header = ws.addRow(table.columns.map((c) => neutraliseCell(c.header)));
  header.font = { bold: true };
  header.border = { bottom: { style: 'thin' } };
  const headerRow = header.number;
  for (const r of table.rows) {
    const row = ws.addRow([]);
    r.forEach((value, i) => setCell(row.getCell(i + 1), value, kindOf ? kindOf(r) : table.columns[i].kind));
  }
  table.columns.forEach((c, i) => (ws.getColumn(i + 1).width = c.width));
  ws.views = [{ state: 'frozen', ySplit: headerRow }];
}

export async function buildReportSpreadsheet(data: ReportData): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Plumeward';
  wb.created = new Date(data.generatedAt);
  wb.modified = new Date(data.generatedAt);
  wb.title = neutraliseCell(`Survey report — ${data.survey.name}`);

  const summary = wb.addWorksheet('Summary');
  titleRows(summary, data, 'Survey report');
  // The value column holds text (site, dates) and numbers: the kind follows the row.
  addTable(summary, summaryTable(data), (r) => (typeof r[1] === 'number' ? summaryKind(String(r[0])) : 'text'));

  for (const [name, title, table] of [
    ['By area', 'Figures by area', areaTable(data)],
    ['Failures', 'Failed traps, costliest first', failureTable(data)],
    ['Trends', 'Surveys of the site side by side', trendTable(data)],
  ] as const) {
    const ws = wb.addWorksheet(name);
    titleRows(ws, data, title);
    addTable(ws, table);
  }

  const method = wb.addWorksheet('Method');
  titleRows(method, data, 'Method and parameters');
  addTable(method, methodTable(data));
  method.addRow([]);
  method.addRow([neutraliseCell(REPORT_CAUTIONS_TITLE)]).font = { bold: true };
  for (const line of REPORT_CAUTIONS) method.addRow([neutraliseCell(line)]);

  const buffer = await wb.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}

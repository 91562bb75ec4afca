// The spreadsheet read back with exceljs: one sheet per table, numbers as numbers with number
// formats (in the site's units), text neutralised, and the status line on every sheet.
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { DRAFT_NOTE } from '@/lib/reports/report-data';
import { buildReportSpreadsheet } from '@/lib/reports/report-spreadsheet';
import { REPORT_CAUTIONS } from '@/lib/reports/cautions';
import { readWorkbook as read, sheetRecords as records } from './read-report';
import { reportFixture } from './report-fixture';

describe('buildReportSpreadsheet', () => {
  it('has one sheet per table, each with the status line', async () => {
    const wb = await read(await buildReportSpreadsheet(reportFixture()));
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Summary', 'By area', 'Failures', 'Trends', 'Method']);
    for (const ws of wb.worksheets) {
      expect(ws.getCell('A2').value).toBe(DRAFT_NOTE);
      expect(ws.headerFooter.oddHeader).toContain(DRAFT_NOTE);
    }
    const published = await read(await buildReportSpreadsheet(reportFixture({ published: true })));
    for (const ws of published.worksheets) expect(String(ws.getCell('A2').value)).toMatch(/^Published 2027-04-21 /);
  });

  it('writes the failures as numbers with formats, costliest first, and neutralises text', async () => {
    const data = reportFixture();
    const rows = records((await read(await buildReportSpreadsheet(data))).getWorksheet('Failures')!);
    expect(rows).toHaveLength(data.figures.failures.length);
    data.figures.failures.forEach((f, i) => {
      const row = rows[i];
      expect(row['Rank'].value).toBe(i + 1);
      expect(row['Steam lost (kg/h)'].type).toBe(ExcelJS.ValueType.Number);
      expect(row['Steam lost (kg/h)'].value).toBeCloseTo(f.kgPerHour, 9);
      expect(row['Steam lost (kg/h)'].numFmt).toBe('#,##0.0');
      expect(row['Cost per year (EUR)'].value).toBeCloseTo(f.costPerYear!, 6);
      expect(row['CO2 per year (t)'].value).toBeCloseTo(f.co2TonnesPerYear, 9);
    });
    const risky = rows.find((r) => r['Tag'].value === "'+FV-X-007")!;
    expect(risky).toBeDefined();
    expect(risky['Area'].value).toBe("'=1+2");
    expect(risky['Area'].type).toBe(ExcelJS.ValueType.String);
    expect(risky['Confirmed'].value).toBe('suggested');
  });

  it('gives the areas with a percentage format and the summary numbers as numbers', async () => {
    const data = reportFixture();
    const wb = await read(await buildReportSpreadsheet(data));
    const areas = records(wb.getWorksheet('By area')!);
    expect(areas.map((a) => a['Area'].value)).toEqual(data.figures.byArea.map((a) => (/^[=@]/.test(a.areaName) ? `'${a.areaName}` : a.areaName)));
    const evaporator = areas.find((a) => a['Area'].value === 'Evaporator Hall')!;
    expect(evaporator['Failure rate'].value).toBeCloseTo(2 / 3, 12);
    expect(evaporator['Failure rate'].numFmt).toBe('0.0%');
    const summary = Object.fromEntries(records(wb.getWorksheet('Summary')!).map((r) => [r['Figure'].value, r['Value']]));
    expect(summary['Tested'].value).toBe(data.figures.total.tested);
    expect(summary['Failure rate'].value).toBeCloseTo(4 / 7, 12);
    expect(summary['Failure rate'].numFmt).toBe('0.0%');
    expect(summary['Steam lost (t/yr)'].value).toBeCloseTo(data.figures.total.lossTonnesPerYear, 9);
    expect(summary['Site'].value).toBe('Fenwick Vale Creamery (FV)');
  });

  it('converts to US customary units in the numbers and names the units in the headers', async () => {
    const data = reportFixture({ unitSystem: 'us' });
    const rows = records((await read(await buildReportSpreadsheet(data))).getWorksheet('Failures')!);
    expect(rows[0]['Steam lost (lb/h)'].value).toBeCloseTo(data.figures.failures[0].kgPerHour / 0.45359237, 9);
    expect(rows[0]['Orifice (in)'].value).toBeCloseTo(data.figures.failures[0].orificeMm / 25.4, 12);
  });

  it('writes the method, the sources and the cautions, and no cell anywhere reads as a formula', async () => {
    const wb = await read(await buildReportSpreadsheet(reportFixture()));
    const method = wb.getWorksheet('Method')!;
    const text: string[] = [];
    method.eachRow((row) => row.eachCell((c) => text.push(String(c.value))));
    expect(text.join('\n')).toContain('docs/verdict-table.md');
    expect(text.join('\n')).toContain('EPA 40 CFR Part 98 Subpart C, Table C-1 (81 FR 89188), 2016');
    for (const c of REPORT_CAUTIONS) expect(text).toContain(c);
    wb.eachSheet((ws) => ws.eachRow((row) => row.eachCell((cell) => {
      expect(cell.type).not.toBe(ExcelJS.ValueType.Formula);
      if (typeof cell.value === 'string') expect(cell.value).not.toMatch(/^[=+\-@\t\r]/);
    })));
  });
});

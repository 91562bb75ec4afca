// The CSV read back with papaparse: one record per failed trap (or area), numbers as numbers,
// text neutralised, and each row naming its survey and status.
import { describe, expect, it } from 'vitest';
import { buildReportCsv } from '@/lib/reports/report-csv';
import { DRAFT_NOTE, reportFileName } from '@/lib/reports/report-data';
import { csvRecords as parse } from './read-report';
import { reportFixture } from './report-fixture';

describe('buildReportCsv', () => {
  it('lists the failures costliest first, numbers as numbers, formula text neutralised', () => {
    const data = reportFixture();
    const bytes = buildReportCsv(data);
    expect(new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes)).toMatch(/^\uFEFFRank,Tag,/);
    const { data: rows, errors } = parse(bytes);
    expect(errors).toEqual([]);
    expect(rows).toHaveLength(data.figures.failures.length);
    data.figures.failures.forEach((f, i) => {
      expect(rows[i]['Rank']).toBe(i + 1);
      expect(rows[i]['Steam lost (kg/h)']).toBeCloseTo(f.kgPerHour, 2);
      expect(rows[i]['Cost per year (EUR)']).toBeCloseTo(f.costPerYear!, 2);
      expect(rows[i]['Survey']).toBe('Spring 2027 survey');
      expect(rows[i]['Status']).toBe(DRAFT_NOTE);
    });
    expect(rows[2]['Tag']).toBe("'+FV-X-007");
    expect(rows[2]['Area']).toBe("'=1+2");
    for (const row of rows) for (const v of Object.values(row)) if (typeof v === 'string') expect(v).not.toMatch(/^[=+\-@\t\r]/);
  });

  it('gives the figures by area with table=areas', () => {
    const data = reportFixture({ published: true });
    const { data: rows } = parse(buildReportCsv(data, 'areas'));
    expect(rows.map((r) => r['Area'])).toEqual(data.figures.byArea.map((a) => (/^[=@]/.test(a.areaName) ? `'${a.areaName}` : a.areaName)));
    const evaporator = rows.find((r) => r['Area'] === 'Evaporator Hall')!;
    expect(evaporator['Failure rate']).toBe(0.6667);
    expect(evaporator['Tested']).toBe(3);
    expect(String(evaporator['Status'])).toMatch(/^Published 2027-04-21/);
  });

  it.each([
    ['pdf', undefined, false, 'plumeward-fv-spring-2027-survey-draft.pdf'],
    ['xlsx', undefined, true, 'plumeward-fv-spring-2027-survey-published-2027-04-21.xlsx'],
    ['csv', 'failures', false, 'plumeward-fv-spring-2027-survey-failures-draft.csv'],
    ['csv', 'areas', true, 'plumeward-fv-spring-2027-survey-by-area-published-2027-04-21.csv'],
  ] as const)('names a %s (%s) file of our own making', (format, table, published, name) => {
    expect(reportFileName(reportFixture({ published }), format, table)).toBe(name);
  });
});

// The PDF read back with pdfjs-dist: the text carries the figures (formatted independently here),
// every page its status line and number, the method and the cautions; the charts are vector paths.
import { describe, expect, it } from 'vitest';
import { REPORT_CAUTIONS } from '@/lib/reports/cautions';
import { loadReportFonts } from '@/lib/reports/fonts';
import { DRAFT_NOTE } from '@/lib/reports/report-data';
import { buildReportPdf } from '@/lib/reports/report-pdf';
import { en, pdfjs, readPdf } from './read-report';
import { reportFixture } from './report-fixture';

// Each build subsets two fonts and each read parses every page: seconds, not milliseconds.
describe('buildReportPdf', { timeout: 30_000 }, () => {
  it('prints the summary figures, the tables and the sections of a draft, in SI', async () => {
    const data = reportFixture();
    const bytes = await buildReportPdf(data, loadReportFonts());
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe('%PDF-');
    const pages = await readPdf(bytes);
    const all = pages.map((p) => p.text).join(' ');
    const t = data.figures.total;
    expect(t.failed).toBe(4);
    for (const expected of [
      'Spring 2027 survey', 'Fenwick Vale Creamery (FV)', '2027-04-05 to 2027-04-09',
      `${t.tested} of ${t.registered}`, `${en((t.failed / t.tested) * 100, 1)} %`,
      `${en(t.lossKgPerHour, 1)} kg/h`, `${en(t.lossTonnesPerYear, 1)} t/yr`, `${en(t.costPerYear!, 0)} EUR`, `${en(t.co2TonnesPerYear, 1)} t CO2/yr`,
      'By area', 'Evaporator Hall', 'Costliest failures', 'FV-EVP-001', 'blowing (blow-through)', 'leaking (suggested)',
      'Trends across surveys', 'Failure rate (% of tested traps)', 'this survey',
      'Method and parameters', 'docs/verdict-table.md', 'coefficient used: 0.60', 'blowing 1.00, leaking 0.25, rapid cycling 0.20',
      '8,000 h per year', 'steam priced at 32.50 EUR per tonne', 'EPA 40 CFR Part 98 Subpart C, Table C-1 (81 FR 89188), 2016',
      ...REPORT_CAUTIONS,
    ]) expect(all).toContain(expected);
    // the costliest failure is the blowing one, and its row carries its loss and cost
    const top = data.figures.failures[0];
    expect(all).toContain(`1 FV-EVP-001 Evaporator Hall blowing (blow-through) ${en(top.kgPerHour, 1)} kg/h ${en(top.tonnesPerYear, 1)} t/yr ${en(top.costPerYear!, 0)} EUR`);
  });

  it('puts the draft note and the page number on every A4 page', async () => {
    const pages = await readPdf(await buildReportPdf(reportFixture(), loadReportFonts()));
    expect(pages.length).toBeGreaterThanOrEqual(2);
    pages.forEach((p, i) => {
      expect(p.view.map((v) => Math.round(v))).toEqual([0, 0, 595, 842]);
      expect(p.text).toContain(DRAFT_NOTE);
      expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  });

  it('a published report carries its publication date (in the site time zone) on every page', async () => {
    const pages = await readPdf(await buildReportPdf(reportFixture({ published: true }), loadReportFonts()));
    for (const p of pages) {
      expect(p.text).toContain('Published 2027-04-21');
      expect(p.text).not.toContain(DRAFT_NOTE);
    }
    expect(pages.map((p) => p.text).join(' ')).toContain('frozen at publication on 2027-04-21, with the settings of that day');
  });

  it('prints US customary units for a US site (1 lb = 0.45359237 kg)', async () => {
    const data = reportFixture({ unitSystem: 'us' });
    const all = (await readPdf(await buildReportPdf(data, loadReportFonts()))).map((p) => p.text).join(' ');
    const t = data.figures.total;
    expect(all).toContain(`${en(t.lossKgPerHour / 0.45359237, 1)} lb/h`);
    expect(all).toContain(`${en(t.lossTonnesPerYear / 0.45359237, 1)} klb/yr`);
    expect(all).toContain('Steam lost (klb/yr)');
    expect(all).not.toContain(' kg/h');
  });

  it('draws the charts as vector paths, with no image, and embeds the shipped font', async () => {
    const bytes = await buildReportPdf(reportFixture(), loadReportFonts());
    const pages = await readPdf(bytes);
    const ops = pages.flatMap((p) => p.ops);
    expect(ops).toContain(pdfjs.OPS.constructPath);
    expect(ops).not.toContain(pdfjs.OPS.paintImageXObject);
    expect(ops).not.toContain(pdfjs.OPS.paintInlineImageXObject);
    const raw = Buffer.from(bytes).toString('latin1');
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+DejaVuSans\b/);
    expect(raw).not.toContain('/Helvetica');
  });

  it('names every failure beyond the printed ones instead of dropping them silently', async () => {
    const data = reportFixture();
    const one = data.figures.failures[0];
    data.figures.failures = Array.from({ length: 34 }, (_, i) => ({ ...one, tag: `FV-TRC-${String(i + 1).padStart(3, '0')}` }));
    const all = (await readPdf(await buildReportPdf(data, loadReportFonts()))).map((p) => p.text).join(' ');
    expect(all).toContain('FV-TRC-030');
    expect(all).not.toContain('FV-TRC-031');
    expect(all).toContain('4 more failed traps are listed in the spreadsheet and the CSV.');
  });
});

// The survey report as a PDF for the plant manager, in our own layout: title block, summary
// figures, the table by area, the costliest failures, trend charts (vector), method and
// parameters, and the safety cautions. A4; every page carries the status line and its number.
import PDFDocument from 'pdfkit';
import { VERDICT_CODES, VERDICT_LABELS } from '@/lib/analysis/verdict-codes';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TITLE } from './cautions';
import type { ReportFonts } from './fonts';
import { annual, co2, count, decimal, flow, money, percent, tableUnits } from './format';
import { methodLines } from './method';
import { drawBarChart } from './pdf-charts';
import { dateInZone, statusLine, type ReportData } from './report-data';

const INK = '#1f2623';
const SOFT = '#4d5652';
const LINE = '#dfe3dd';
const ACCENT = '#137067';
const ACCENT_BG = '#eaf3f1';
const LOSS = '#a35200';
const CAUTION_BG = '#fdf4e3';
const CAUTION_LINE = '#c98a1b';
const R = 'Regular';
const B = 'Bold';

/** The costliest failures printed; the spreadsheet and the CSV list them all. */
export const PDF_FAILURE_ROWS = 30;

type Align = 'left' | 'right';
type PdfColumn = { header: string; width: number; align?: Align };

class Layout {
  readonly left: number;
  readonly right: number;
  readonly bottom: number;

  constructor(readonly doc: PDFKit.PDFDocument) {
    const { margins, width, height } = doc.page;
    this.left = margins.left;
    this.right = width - margins.right;
    this.bottom = height - margins.bottom;
  }

  get width() {
    return this.right - this.left;
  }

  /** A new page when fewer than `height` points remain. */
  room(height: number) {
    if (this.doc.y + height > this.bottom) this.doc.addPage();
  }

  /** A section title, kept on one page with the first `keep` points of what follows. */
  heading(text: string, keep = 60) {
    this.room(keep);
    const { doc } = this;
    doc.moveDown(0.8);
    doc.font(B).fontSize(13).fillColor(ACCENT).text(text, this.left, doc.y, { width: this.width });
    doc.moveTo(this.left, doc.y + 2).lineTo(this.right, doc.y + 2).lineWidth(0.8).strokeColor(ACCENT).stroke();
    doc.y += 8;
    doc.fillColor(INK);
  }

  paragraph(text: string, size = 9, color = INK) {
    this.doc.font(R).fontSize(size).fillColor(color).text(text, this.left, this.doc.y, { width: this.width });
    this.doc.fillColor(INK);
  }

  /** Cuts text to fit a cell, with an ellipsis. */
  fit(text: string, width: number) {
    const { doc } = this;
    if (doc.widthOfString(text) <= width) return text;
    let cut = text;
    while (cut.length > 1 && doc.widthOfString(`${cut}…`) > width) cut = cut.slice(0, -1);
    return `${cut}…`;
  }

  table(columns: PdfColumn[], rows: string[][], opts: { boldLast?: boolean } = {}) {
    const { doc } = this;
    const rowH = 15;
    const pad = 3;
    const total = columns.reduce((s, c) => s + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const drawRow = (cells: string[], bold: boolean, fill: string | null, height = rowH) => {
      const y = doc.y;
      if (fill) doc.rect(this.left, y, this.width, height).fill(fill);
      let x = this.left;
      doc.font(bold ? B : R).fontSize(8).fillColor(INK);
      cells.forEach((cell, i) => {
        const w = widths[i] - 2 * pad;
        const align = columns[i].align ?? 'left';
        // A header may take two lines; a body cell keeps to one.
        if (height > rowH) doc.text(cell, x + pad, y + 4, { width: w, align, height: height - 4, ellipsis: true });
        else doc.text(this.fit(cell, w), x + pad, y + 4, { width: w, align, lineBreak: false });
        x += widths[i];
      });
      doc.y = y + height;
    };
    const header = () => {
      doc.font(B).fontSize(8);
      const lines = columns.some((c, i) => doc.widthOfString(c.header) > widths[i] - 2 * pad) ? 2 : 1;
      drawRow(columns.map((c) => c.header), true, ACCENT_BG, lines === 2 ? 25 : rowH);
      doc.moveTo(this.left, doc.y).lineTo(this.right, doc.y).lineWidth(0.6).strokeColor(ACCENT).stroke();
    };
    this.room(rowH * 3);
    header();
    rows.forEach((cells, i) => {
      if (doc.y + rowH > this.bottom) {
        doc.addPage();
        header();
      }
      const last = i === rows.length - 1 && opts.boldLast;
      if (last) doc.moveTo(this.left, doc.y).lineTo(this.right, doc.y).lineWidth(0.6).strokeColor(SOFT).stroke();
      drawRow(cells, Boolean(last), i % 2 === 1 && !last ? '#f6f7f4' : null);
    });
    doc.moveTo(this.left, doc.y).lineTo(this.right, doc.y).lineWidth(0.4).strokeColor(LINE).stroke();
    doc.y += 4;
    doc.x = this.left;
  }
}

function titleBlock(l: Layout, data: ReportData) {
  const { doc } = l;
  const { survey, site } = data;
  doc.font(B).fontSize(8.5).fillColor(ACCENT).text('PLUMEWARD · STEAM TRAP SURVEY REPORT', l.left, doc.y, { characterSpacing: 0.8 });
  doc.moveDown(0.4);
  doc.font(B).fontSize(20).fillColor(INK).text(survey.name, { width: l.width });
  doc.font(R).fontSize(12).fillColor(INK).text(`${site.name} (${site.code})`, { width: l.width });
  doc.moveDown(0.5);
  const lines: [string, string][] = [
    ['Survey dates', `${survey.startsOn} to ${survey.endsOn}`],
    ['Status', data.frozen && survey.publishedAt ? `published on ${dateInZone(survey.publishedAt, site.timeZone)}` : `draft (${survey.status.replace('_', ' ')})`],
    ['Prepared', `${dateInZone(data.generatedAt, site.timeZone)} (${site.timeZone})`],
    ['Units', site.unitSystem === 'us' ? 'US customary' : 'SI'],
  ];
  for (const [label, value] of lines) {
    const y = doc.y;
    doc.font(B).fontSize(9).fillColor(SOFT).text(label, l.left, y, { width: 90 });
    doc.font(R).fontSize(9).fillColor(INK).text(value, l.left + 90, y, { width: l.width - 90 });
  }
  doc.moveDown(0.6);
  const y = doc.y;
  const note = statusLine(data);
  const draft = !(data.frozen && survey.publishedAt);
  doc.rect(l.left, y, l.width, 24).lineWidth(1).fillAndStroke(draft ? CAUTION_BG : ACCENT_BG, draft ? CAUTION_LINE : ACCENT);
  doc.font(B).fontSize(10).fillColor(INK).text(note, l.left + 10, y + 7, { width: l.width - 20, lineBreak: false });
  doc.y = y + 30;
  doc.x = l.left;
}

function summaryFigures(l: Layout, data: ReportData) {
  const { doc } = l;
  const t = data.figures.total;
  const system = data.site.unitSystem;
  l.heading('Summary');
  const tiles: [string, string, string][] = [
    ['Tested', `${count(t.tested)} of ${count(t.registered)}`, `registered traps (${count(t.inService)} in service)`],
    ['Failure rate', percent(t.failureRate), `${count(t.failed)} failed of ${count(t.tested)} tested`],
    ['Steam lost', flow(t.lossKgPerHour, system), 'through failed traps, now'],
    ['Steam lost per year', annual(t.lossTonnesPerYear, system), `at ${count(data.figures.basis.operatingHoursPerYear)} operating hours`],
    ['Cost per year', money(t.costPerYear, data.settings.currency), 'of the steam lost'],
    ['CO2 per year', co2(t.co2TonnesPerYear), 'from the fuel that raised it'],
  ];
  const gap = 8;
  const w = (l.width - 2 * gap) / 3;
  const h = 50;
  const top = doc.y;
  tiles.forEach(([label, value, sub], i) => {
    const x = l.left + (i % 3) * (w + gap);
    const y = top + Math.floor(i / 3) * (h + gap);
    doc.rect(x, y, w, h).fill(ACCENT_BG);
    doc.rect(x, y, 3, h).fill(ACCENT);
    doc.font(R).fontSize(8).fillColor(SOFT).text(label, x + 10, y + 6, { width: w - 16, lineBreak: false });
    doc.font(B).fontSize(14).fillColor(INK).text(value, x + 10, y + 18, { width: w - 16, lineBreak: false });
    doc.font(R).fontSize(7).fillColor(SOFT).text(sub, x + 10, y + 37, { width: w - 16, lineBreak: false });
  });
  doc.y = top + 2 * h + gap + 10;
  doc.x = l.left;
  const verdicts = VERDICT_CODES.filter((v) => t.verdicts[v] > 0).map((v) => `${VERDICT_LABELS[v]} ${t.verdicts[v]}`).join(' · ');
  l.paragraph(`Verdicts of the tested traps: ${verdicts || 'none yet'}.`);
  l.paragraph(`Confirmed by an analyst: ${count(t.decided)} of ${count(t.tested)} tested; re-test pending: ${count(t.retestPending)}; not tested: ${count(t.untested)}.`);
}

function byArea(l: Layout, data: ReportData) {
  const system = data.site.unitSystem;
  const cur = data.settings.currency;
  l.heading('By area');
  const row = (a: ReportData['figures']['total'], name: string) => [
    name, count(a.registered), count(a.tested), count(a.failed), percent(a.failureRate), flow(a.lossKgPerHour, system), annual(a.lossTonnesPerYear, system),
    money(a.costPerYear, cur), decimal(a.co2TonnesPerYear, 1),
  ];
  l.table(
    [
      { header: 'Area', width: 20 }, { header: 'Registered', width: 12, align: 'right' }, { header: 'Tested', width: 8, align: 'right' },
      { header: 'Failed', width: 7, align: 'right' }, { header: 'Failure rate', width: 10, align: 'right' }, { header: 'Steam lost', width: 12, align: 'right' },
      { header: 'Per year', width: 12, align: 'right' }, { header: 'Cost per year', width: 13, align: 'right' }, { header: 'CO2 t/yr', width: 9, align: 'right' },
    ],
    [...data.figures.byArea.map((a) => row(a, a.areaName)), row(data.figures.total, 'All areas')],
    { boldLast: true },
  );
}

function failures(l: Layout, data: ReportData) {
  const system = data.site.unitSystem;
  const cur = data.settings.currency;
  const all = data.figures.failures;
  l.heading('Costliest failures');
  if (all.length === 0) {
    l.paragraph('No failed trap in this survey.');
    return;
  }
  l.table(
    [
      { header: '#', width: 4, align: 'right' }, { header: 'Tag', width: 15 }, { header: 'Area', width: 19 }, { header: 'Verdict', width: 20 },
      { header: 'Steam lost', width: 12, align: 'right' }, { header: 'Per year', width: 12, align: 'right' }, { header: 'Cost per year', width: 13, align: 'right' },
    ],
    all.slice(0, PDF_FAILURE_ROWS).map((f, i) => [
      String(i + 1), f.tag, f.areaName ?? 'No area', `${VERDICT_LABELS[f.verdict]}${f.decided ? '' : ' (suggested)'}`,
      flow(f.kgPerHour, system), annual(f.tonnesPerYear, system), money(f.costPerYear, cur),
    ]),
  );
  if (all.length > PDF_FAILURE_ROWS) {
    l.paragraph(`${all.length - PDF_FAILURE_ROWS} more failed traps are listed in the spreadsheet and the CSV.`, 8, SOFT);
  }
}

function trends(l: Layout, data: ReportData) {
  const { doc } = l;
  const system = data.site.unitSystem;
  const surveys = data.trends.surveys;
  const chartH = 170;
  l.heading('Trends across surveys', chartH + 40);
  if (surveys.length === 0) {
    l.paragraph('No survey with results yet.');
    return;
  }
  l.room(chartH + 10);
  const gap = 18;
  const w = (l.width - gap) / 2;
  const y = doc.y;
  const label = (s: (typeof surveys)[number]) => s.startsOn.slice(0, 7);
  const lossUnit = system === 'us' ? 'klb/yr' : 't/yr';
  const { toAnnual } = tableUnits(system);
  drawBarChart(doc, {
    x: l.left, y, width: w, height: chartH, title: 'Failure rate (% of tested traps)', color: ACCENT, fonts: { regular: R, bold: B },
    points: surveys.map((s) => ({ label: label(s), value: s.failureRate === null ? null : s.failureRate * 100, current: s.id === data.survey.id })),
    format: (v) => `${v.toFixed(v >= 10 || v === 0 ? 0 : 1)} %`,
  });
  drawBarChart(doc, {
    x: l.left + w + gap, y, width: w, height: chartH, title: `Steam lost (${lossUnit})`, color: LOSS, fonts: { regular: R, bold: B },
    points: surveys.map((s) => ({ label: label(s), value: toAnnual(s.lossTonnesPerYear), current: s.id === data.survey.id })),
    format: (v) => v.toLocaleString('en-US', { maximumFractionDigits: v >= 100 ? 0 : 1 }),
  });
  doc.y = y + chartH + 8;
  doc.x = l.left;
  l.paragraph('Each bar is one survey of the site, oldest first, labelled by the month it began; draft surveys follow the current settings.', 7.5, SOFT);

  if (data.trends.areas.length > 0) {
    doc.moveDown(0.6);
    doc.font(B).fontSize(9).fillColor(INK).text('Failure rate by area, survey by survey', l.left, doc.y);
    doc.moveDown(0.3);
    l.table(
      [{ header: 'Area', width: 24 }, ...surveys.map((s) => ({ header: label(s) + (s.id === data.survey.id ? ' (this)' : ''), width: 12, align: 'right' as Align }))],
      data.trends.areas.map((a) => [a.areaName, ...a.bySurvey.map((x) => (x ? percent(x.failureRate) : '—'))]),
    );
  }
}

function method(l: Layout, data: ReportData) {
  const { doc } = l;
  l.heading('Method and parameters');
  const labelW = 95;
  for (const { label, value } of methodLines(data)) {
    doc.font(R).fontSize(8.5);
    const h = doc.heightOfString(value, { width: l.width - labelW });
    l.room(h + 4);
    const y = doc.y;
    doc.font(B).fontSize(8.5).fillColor(SOFT).text(label, l.left, y, { width: labelW - 6 });
    doc.font(R).fontSize(8.5).fillColor(INK).text(value, l.left + labelW, y, { width: l.width - labelW });
    doc.y = Math.max(doc.y, y + h) + 3;
  }
  doc.x = l.left;
}

function cautions(l: Layout) {
  const { doc } = l;
  l.heading('Safety');
  doc.font(R).fontSize(8.5);
  const bodyW = l.width - 32;
  const heights = REPORT_CAUTIONS.map((c) => doc.heightOfString(c, { width: bodyW }) + 3);
  const boxH = 26 + heights.reduce((s, h) => s + h, 0) + 6;
  l.room(boxH + 4);
  const top = doc.y;
  doc.rect(l.left, top, l.width, boxH).lineWidth(1).fillAndStroke(CAUTION_BG, CAUTION_LINE);
  // A warning triangle as a path, beside the words (the state is said in text, not by shape alone).
  doc.moveTo(l.left + 16, top + 8).lineTo(l.left + 23, top + 20).lineTo(l.left + 9, top + 20).closePath().lineWidth(1.2).strokeColor(INK).stroke();
  doc.moveTo(l.left + 16, top + 12).lineTo(l.left + 16, top + 16.5).lineWidth(1.2).stroke();
  doc.font(B).fontSize(10).fillColor(INK).text(REPORT_CAUTIONS_TITLE, l.left + 30, top + 9, { width: l.width - 40 });
  let y = top + 26;
  REPORT_CAUTIONS.forEach((c, i) => {
    doc.circle(l.left + 20, y + 4.5, 1.5).fill(INK);
    doc.font(R).fontSize(8.5).fillColor(INK).text(c, l.left + 28, y, { width: bodyW });
    y += heights[i];
  });
  doc.y = top + boxH + 6;
  doc.x = l.left;
}

function pageFurniture(doc: PDFKit.PDFDocument, data: ReportData) {
  const range = doc.bufferedPageRange();
  const note = statusLine(data);
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const { margins, width, height } = doc.page;
    const bottom = margins.bottom;
    // Writing inside the margins must not start another page.
    doc.page.margins.bottom = 0;
    const left = margins.left;
    const w = width - margins.left - margins.right;
    doc.font(R).fontSize(7.5).fillColor(SOFT)
      .text(`${data.site.name} · ${data.survey.name}`, left, 26, { width: w * 0.7, lineBreak: false });
    doc.text('Plumeward', left + w * 0.7, 26, { width: w * 0.3, align: 'right', lineBreak: false });
    const fy = height - bottom + 18;
    doc.moveTo(left, fy - 6).lineTo(left + w, fy - 6).lineWidth(0.5).strokeColor(LINE).stroke();
    doc.font(B).fontSize(7.5).fillColor(INK).text(note, left, fy, { width: w * 0.75, lineBreak: false });
    doc.font(R).text(`Page ${i - range.start + 1} of ${range.count}`, left + w * 0.75, fy, { width: w * 0.25, align: 'right', lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

export function buildReportPdf(data: ReportData, fonts: ReportFonts): Promise<Uint8Array> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: 50, bottom: 56, left: 48, right: 48 },
    bufferPages: true,
    // Our own font from the first line, so pdfkit never loads its built-in Helvetica.
    font: Buffer.from(fonts.regular) as unknown as string,
    info: {
      Title: `Survey report — ${data.survey.name}, ${data.site.name}`,
      Author: 'Plumeward',
      Creator: 'Plumeward',
      Producer: 'Plumeward',
      Subject: statusLine(data),
      CreationDate: new Date(data.generatedAt),
    },
  });
  doc.registerFont(R, Buffer.from(fonts.regular));
  doc.registerFont(B, Buffer.from(fonts.bold));
  const chunks: Buffer[] = [];
  const done = new Promise<Uint8Array>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(new Uint8Array(Buffer.concat(chunks))));
    doc.on('error', reject);
  });
  const l = new Layout(doc);
  doc.font(R);
  titleBlock(l, data);
  summaryFigures(l, data);
  byArea(l, data);
  failures(l, data);
  trends(l, data);
  method(l, data);
  cautions(l);
  pageFurniture(doc, data);
  doc.end();
  return done;
}

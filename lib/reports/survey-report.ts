import 'server-only';
// Gathers a survey's report data (the figures as the survey page shows them, the site, the
// trend up to this survey) and answers with the file. The builders beside it do the rest.
import { surveySummary, siteTrends } from '@/lib/services/outcomes';
import { getSite } from '@/lib/services/sites';
import { loadReportFonts } from './fonts';
import { CONTENT_TYPES, reportFileName, type CsvTable, type ReportData, type ReportFormat } from './report-data';
import { buildReportCsv } from './report-csv';
import { buildReportPdf } from './report-pdf';
import { buildReportSpreadsheet } from './report-spreadsheet';

export async function surveyReportData(surveyId: number, now = new Date()): Promise<ReportData> {
  const summary = await surveySummary(surveyId);
  const site = await getSite(summary.survey.siteId);
  const trends = await siteTrends(site.id);
  // A report looks back from its own survey: later surveys are not part of its story.
  const keep = trends.surveys.map((s) => s.id === summary.survey.id || s.startsOn <= summary.survey.startsOn);
  const surveys = trends.surveys.filter((_, i) => keep[i]).map((s) => ({
    id: s.id, name: s.name, startsOn: s.startsOn, status: s.status, frozen: s.frozen, tested: s.total.tested, failed: s.total.failed,
    failureRate: s.total.failureRate, lossKgPerHour: s.total.lossKgPerHour, lossTonnesPerYear: s.total.lossTonnesPerYear,
    costPerYear: s.total.costPerYear, co2TonnesPerYear: s.total.co2TonnesPerYear,
  }));
  const areas = trends.areas
    .map((a) => ({ areaName: a.areaName, bySurvey: a.bySurvey.filter((_, i) => keep[i]) }))
    .filter((a) => a.bySurvey.some(Boolean));
  return {
    site: { name: site.name, code: site.code, timeZone: site.timeZone, currency: site.currency, unitSystem: site.unitSystem },
    survey: summary.survey, frozen: summary.frozen, settings: summary.settings, figures: summary.figures,
    trends: { surveys, areas }, generatedAt: now.toISOString(),
  };
}

/** The report file of a survey, ready to send. */
export async function surveyReport(surveyId: number, format: ReportFormat, table: CsvTable = 'failures'): Promise<Response> {
  const data = await surveyReportData(surveyId);
  const bytes = format === 'pdf' ? await buildReportPdf(data, loadReportFonts())
    : format === 'xlsx' ? await buildReportSpreadsheet(data)
      : buildReportCsv(data, table);
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': CONTENT_TYPES[format],
      'content-disposition': `attachment; filename="${reportFileName(data, format, table)}"`,
      'content-length': String(bytes.byteLength),
      // Figures of a draft change with its verdicts and settings; and a report is not for shared caches.
      'cache-control': 'private, no-store',
    },
  });
}

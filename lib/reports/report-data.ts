// What a survey report is made of: plain data, gathered by the service (survey-report.ts) and
// turned into bytes by the builders (pdf.ts, spreadsheet.ts, tables.ts). Nothing here reads a
// database or a clock, so the builders can be tested on data made by hand.
import type { CostSettings } from '@/lib/outcomes/cost-params';
import type { SurveyFigures } from '@/lib/outcomes/survey-figures';
import type { SurveyStatus, UnitSystem } from '@/lib/domain/vocabulary';

export type ReportSite = { name: string; code: string; timeZone: string; currency: string; unitSystem: UnitSystem };

export type ReportSurvey = {
  id: number; name: string; startsOn: string; endsOn: string; status: SurveyStatus | string; publishedAt: string | null;
};

/** One survey in the site's trend: totals, and per area in the order of `areaNames`. */
export type TrendSurvey = {
  id: number; name: string; startsOn: string; status: string; frozen: boolean;
  tested: number; failed: number; failureRate: number | null; lossKgPerHour: number; lossTonnesPerYear: number;
  costPerYear: number | null; co2TonnesPerYear: number;
};
export type TrendArea = {
  areaName: string;
  bySurvey: ({ tested: number; failed: number; failureRate: number | null; lossKgPerHour: number; costPerYear: number | null } | null)[];
};

export type ReportData = {
  site: ReportSite;
  survey: ReportSurvey;
  /** True when the figures and settings are those frozen at publication. */
  frozen: boolean;
  settings: CostSettings;
  figures: SurveyFigures;
  /** Surveys of the site up to and including this one, oldest first. */
  trends: { surveys: TrendSurvey[]; areas: TrendArea[] };
  /** When the file was made (ISO 8601); passed in so that the builders stay pure. */
  generatedAt: string;
};

export const REPORT_FORMATS = ['pdf', 'xlsx', 'csv'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];
export const CSV_TABLES = ['failures', 'areas'] as const;
export type CsvTable = (typeof CSV_TABLES)[number];

export const CONTENT_TYPES: Record<ReportFormat, string> = {
  pdf: 'application/pdf',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  csv: 'text/csv; charset=utf-8; header=present',
};

export const DRAFT_NOTE = 'Draft — figures follow the current settings';

/** The calendar date of an instant in the site's time zone, as YYYY-MM-DD. */
export function dateInZone(iso: string, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(new Date(iso));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/** The line every page and sheet carries: a draft says whose settings it follows; a published report, its date. */
export function statusLine(data: Pick<ReportData, 'frozen' | 'survey' | 'site'>): string {
  if (data.frozen && data.survey.publishedAt) {
    return `Published ${dateInZone(data.survey.publishedAt, data.site.timeZone)} — figures and settings as published`;
  }
  return DRAFT_NOTE;
}

const slug = (text: string) =>
  text.normalize('NFKD').replace(/[^\x20-\x7e]/g, '').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'survey';

/** Our own file name: site code, survey, and draft or the publication date; ASCII only, so any browser keeps it. */
export function reportFileName(data: Pick<ReportData, 'frozen' | 'survey' | 'site'>, format: ReportFormat, table?: CsvTable): string {
  const state = data.frozen && data.survey.publishedAt ? `published-${dateInZone(data.survey.publishedAt, data.site.timeZone)}` : 'draft';
  const part = format === 'csv' ? `-${table === 'areas' ? 'by-area' : 'failures'}` : '';
  return `plumeward-${slug(data.site.code)}-${slug(data.survey.name)}${part}-${state}.${format}`;
}

import { DRAFT_NOTE } from '@/lib/reports/report-data';

const FORMATS = [
  { format: 'pdf', label: 'PDF report', hint: 'summary, tables, trends, method and cautions' },
  { format: 'xlsx', label: 'Spreadsheet', hint: 'one sheet per table' },
  { format: 'csv', label: 'CSV', hint: 'failed traps, costliest first' },
] as const;

/** The report path of a survey in one format (the API checks access on every download). */
export const reportHref = (surveyId: number, format: (typeof FORMATS)[number]['format']) => `/api/surveys/${surveyId}/report?format=${format}`;

/**
 * Links to a survey's report in its three formats. Plain links: it works in a server component,
 * needs no script, and a viewer may use it (reading reports is `survey.read`).
 */
export function ReportDownloads({ surveyId, published }: { surveyId: number; published: boolean }) {
  return (
    <section aria-labelledby={`report-downloads-${surveyId}`} className="rounded-lg border border-line bg-surface-raised p-4" data-testid="report-downloads">
      <h2 id={`report-downloads-${surveyId}`} className="text-sm font-semibold text-ink">Survey report</h2>
      <p className="mt-1 text-xs text-ink-soft">
        {published ? 'Figures and settings as published.' : `${DRAFT_NOTE}.`}
      </p>
      <ul className="mt-3 flex flex-wrap gap-2">
        {FORMATS.map((f) => (
          <li key={f.format}>
            <a href={reportHref(surveyId, f.format)} download className="btn-quiet" title={f.hint}>
              <svg viewBox="0 0 16 16" className="h-4 w-4" aria-hidden="true"><path d="M8 2v8m0 0L5 7m3 3 3-3M3 13h10" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" /></svg>
              {f.label}
              <span className="sr-only"> ({f.hint})</span>
            </a>
          </li>
        ))}
      </ul>
    </section>
  );
}

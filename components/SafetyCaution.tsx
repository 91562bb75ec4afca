import { SAFETY_POINTS, SAFETY_TITLE } from '@/lib/domain/safety';

/**
 * The cautions shown wherever Plumeward guides field work or repairs. Steam work can hurt people;
 * the product reminds, it does not replace the site's permit-to-work and local codes.
 */
export function SafetyCaution({ context = SAFETY_TITLE, compact = false }: { context?: string; compact?: boolean }) {
  return (
    <aside role="note" aria-label="Safety" className="rounded-lg border border-caution-line bg-caution-bg p-4 text-sm text-caution-ink" data-testid="safety-caution">
      <div className="mb-2 flex items-center gap-2 font-semibold">
        <svg viewBox="0 0 20 20" className="h-5 w-5" aria-hidden="true"><path d="M10 2 19 18H1L10 2z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" /><path d="M10 8v4.5M10 14.8v.4" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" /></svg>
        {context}
      </div>
      <ul className={`list-disc space-y-1 pl-5 ${compact ? 'text-xs' : ''}`}>
        {SAFETY_POINTS.map((point) => <li key={point}>{point}</li>)}
      </ul>
    </aside>
  );
}

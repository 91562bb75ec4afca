import { VERDICT_CODES, VERDICT_LABELS, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { VERDICT_STYLE } from '@/components/review/VerdictBadge';

/** Verdict counts as one stacked bar, each part named beside its shape (never colour alone). */
export function VerdictBar({ counts }: { counts: Record<VerdictCode, number> }) {
  const total = VERDICT_CODES.reduce((s, c) => s + counts[c], 0);
  if (!total) return <p className="text-sm text-ink-soft">No trap tested yet.</p>;
  return (
    <div className="space-y-2">
      <div className="flex h-4 overflow-hidden rounded" role="img" aria-label={VERDICT_CODES.filter((c) => counts[c]).map((c) => `${VERDICT_LABELS[c]} ${counts[c]}`).join(', ')}>
        {VERDICT_CODES.filter((c) => counts[c]).map((c) => (
          <div key={c} style={{ width: `${(100 * counts[c]) / total}%`, background: VERDICT_STYLE[c].colour }} />
        ))}
      </div>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs" data-testid="verdict-counts">
        {VERDICT_CODES.filter((c) => counts[c]).map((c) => (
          <li key={c}><span aria-hidden="true" style={{ color: VERDICT_STYLE[c].colour }}>{VERDICT_STYLE[c].shape}</span> {VERDICT_LABELS[c]} <strong>{counts[c]}</strong></li>
        ))}
      </ul>
    </div>
  );
}

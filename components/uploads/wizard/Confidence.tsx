import { percent } from './draftProfile';

/** What detection suggested for a field and how sure it was; says so when the analyst changed it. */
export function Confidence({ confidence, reason, changed }: { confidence: number | null; reason?: string; changed?: boolean }) {
  if (confidence === null) return <p className="mt-1 text-xs text-ink-faint">Not detected: set it by hand.</p>;
  const level = confidence >= 0.8 ? 'sure' : confidence >= 0.55 ? 'fairly sure' : 'unsure';
  const mark = confidence >= 0.8 ? '●' : confidence >= 0.55 ? '◐' : '○';
  return (
    <p className="mt-1 text-xs text-ink-soft" data-testid="confidence">
      <span aria-hidden="true" className="text-accent-600">{mark}</span> {changed ? 'You changed the suggestion' : `Suggested, ${level} (${percent(confidence)})`}
      {reason ? <span className="text-ink-faint"> — {reason}</span> : null}
    </p>
  );
}

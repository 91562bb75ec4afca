import { SURVEY_STATUS_LABELS, type SurveyStatus } from '@/lib/domain/vocabulary';

// State is told by a word and a shape, not colour alone.
const SHAPE: Record<SurveyStatus, string> = { planned: '○', in_progress: '◐', published: '●' };

export function SurveyStatusLabel({ status }: { status: SurveyStatus }) {
  return (
    <span className="inline-flex items-center gap-1 text-xs text-ink-soft">
      <span aria-hidden="true" className="text-accent-600">{SHAPE[status]}</span>
      {SURVEY_STATUS_LABELS[status]}
    </span>
  );
}

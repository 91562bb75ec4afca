// Verdict codes and their order (BRIEF §4a). Codes are the API's and the command
// line's; labels are the words shown on screen.

export const VERDICT_CODES = [
  'blowing',
  'leaking',
  'backing_up',
  'cold',
  'background_noise',
  'inconclusive',
  'out_of_service',
  'working',
] as const;

export type VerdictCode = (typeof VERDICT_CODES)[number];

export type Confidence = 'high' | 'medium' | 'low';

export const VERDICT_LABELS: Record<VerdictCode, string> = {
  blowing: 'blowing (blow-through)',
  leaking: 'leaking',
  backing_up: 'backing up',
  cold: 'cold',
  background_noise: 'background noise — re-check',
  inconclusive: 'inconclusive',
  out_of_service: 'out of service',
  working: 'working',
};

/** Failed = blowing, leaking, backing up, cold (BRIEF §4a). */
export const FAILED_VERDICTS: ReadonlySet<VerdictCode> = new Set(['blowing', 'leaking', 'backing_up', 'cold']);

export function isFailed(code: VerdictCode): boolean {
  return FAILED_VERDICTS.has(code);
}

/** 0 for the worst (blowing) … 7 for working; VERDICT_CODES is listed worst first. */
export function severityRank(code: VerdictCode): number {
  return VERDICT_CODES.indexOf(code);
}

/** Comparator for review queues and reports: worst first. */
export function compareSeverity(a: VerdictCode, b: VerdictCode): number {
  return severityRank(a) - severityRank(b);
}

export function isVerdictCode(value: unknown): value is VerdictCode {
  return typeof value === 'string' && (VERDICT_CODES as readonly string[]).includes(value);
}

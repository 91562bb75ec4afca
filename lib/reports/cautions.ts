// The safety cautions every report carries: the one list of lib/domain/safety.ts, as plain text.
import { SAFETY_POINTS, SAFETY_TITLE } from '@/lib/domain/safety';

export const REPORT_CAUTIONS_TITLE = SAFETY_TITLE;
export const REPORT_CAUTIONS: readonly string[] = SAFETY_POINTS;

import type { REPORT_ROUTES } from '@/lib/api/report-routes';
import type { Sample } from './sample';

export const REPORT_SAMPLES: Record<keyof typeof REPORT_ROUTES, Sample> = {
  surveyReport: (s) => ({ params: { surveyId: s.surveyId } }),
};

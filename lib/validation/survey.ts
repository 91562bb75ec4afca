import { z } from 'zod';
import { SURVEY_STATUSES } from '@/lib/domain/vocabulary';
import { isoDateSchema } from './common';

const surveyFields = z.object({
  name: z.string().trim().min(1, 'A survey needs a name.').max(120),
  startsOn: isoDateSchema,
  endsOn: isoDateSchema,
  status: z.enum(SURVEY_STATUSES).default('planned'),
});

export const surveyInputSchema = surveyFields.refine((s) => s.endsOn >= s.startsOn, {
  message: 'The survey cannot end before it starts.',
  path: ['endsOn'],
});
export type SurveyInput = z.output<typeof surveyInputSchema>;

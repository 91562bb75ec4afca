import { z } from 'zod';
import { optionalText } from './common';

export const areaInputSchema = z.object({
  name: z.string().trim().min(1, 'An area needs a name.').max(120),
  description: optionalText(1000),
});
export type AreaInput = z.output<typeof areaInputSchema>;

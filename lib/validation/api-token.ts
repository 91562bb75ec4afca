import { z } from 'zod';
import { idSchema } from './common';

export const apiTokenInputSchema = z.object({
  name: z.string().trim().min(1, 'Name the token after the script that will use it.').max(80),
  userId: idSchema,
  readOnly: z.boolean().default(false),
  /** Omit or leave empty for all of the owner's sites. */
  siteIds: z.array(idSchema).optional().transform((v) => (v && v.length ? v : null)),
});
export type ApiTokenInput = z.output<typeof apiTokenInputSchema>;

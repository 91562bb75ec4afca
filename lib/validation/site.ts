import { z } from 'zod';
import { UNIT_SYSTEMS } from '@/lib/domain/vocabulary';
import { timeZoneSchema } from './common';

export const siteInputSchema = z.object({
  name: z.string().trim().min(1, 'A site needs a name.').max(120),
  code: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{2,12}$/, 'A short code of 2–12 letters or digits, e.g. FV.'),
  timeZone: timeZoneSchema,
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'A three-letter ISO 4217 currency code, e.g. EUR.'),
  unitSystem: z.enum(UNIT_SYSTEMS),
  ambientC: z.number().min(-40).max(60).default(20),
});
export type SiteInput = z.output<typeof siteInputSchema>;
export const siteUpdateSchema = siteInputSchema.partial();

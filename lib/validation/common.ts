import { z } from 'zod';

/** A record id as it arrives in a path or query string, or as a JSON number. */
export const idSchema = z.coerce.number().int().positive();

export const pageQuery = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
};

/** An IANA zone name the runtime knows (Intl throws for unknown ones). */
export const timeZoneSchema = z.string().refine((tz) => {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}, 'Not a known IANA time zone, e.g. Europe/London.');

export const isoDateSchema = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Expected a date as YYYY-MM-DD.');

/** Trims, and turns an empty string into null: how optional text fields arrive from forms. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .nullable()
    .optional()
    .transform((v) => (v ? v : null));

import { z } from 'zod';
import {
  APPLICATIONS, CRITICALITIES, DISCHARGES_TO, TRAP_STATUSES, TRAP_TYPES,
} from '@/lib/domain/vocabulary';
import { idSchema, optionalText, pageQuery } from './common';

// Shared by the trap form (client), the API and the register CSV import.
export const tagSchema = z
  .string()
  .trim()
  .min(1, { error: 'A tag is required.', abort: true })
  .max(40, 'A tag is at most 40 characters.')
  .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]*$/, 'A tag is letters, digits and . _ / - (starting with a letter or digit).');

const numberOf = (label: string) =>
  z.number({ error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be a number.`) });

export const trapInputSchema = z.object({
  tag: tagSchema,
  areaId: idSchema.nullable().optional().transform((v) => v ?? null),
  location: optionalText(200),
  trapType: z.enum(TRAP_TYPES, { error: `Trap type must be one of ${TRAP_TYPES.join(', ')}.` }),
  application: z.enum(APPLICATIONS).nullable().optional().transform((v) => v ?? null),
  sizeDn: numberOf('Connection size (DN)').int('DN is a whole number.').min(6, 'DN is at least 6.').max(600, 'DN is at most 600.').nullable().optional()
    .transform((v) => v ?? null),
  orificeMm: numberOf('Orifice (mm)').positive('Orifice must be above 0 mm.').max(60, 'Orifice is at most 60 mm.').nullable().optional()
    .transform((v) => v ?? null),
  pressureBarg: numberOf('Line pressure (barg)')
    .min(0, 'Line pressure is 0 barg or more.')
    .max(100, 'Line pressure is at most 100 barg.'),
  dischargesTo: z.enum(DISCHARGES_TO).default('return'),
  criticality: z.enum(CRITICALITIES).default('normal'),
  status: z.enum(TRAP_STATUSES).default('in_service'),
});
export type TrapInput = z.output<typeof trapInputSchema>;

export const trapUpdateSchema = trapInputSchema.partial();

export const TRAP_SORT_FIELDS = ['tag', 'area', 'trapType', 'pressureBarg', 'sizeDn', 'status', 'criticality', 'updatedAt'] as const;

export const trapListQuerySchema = z.object({
  ...pageQuery,
  sort: z.enum(TRAP_SORT_FIELDS).default('tag'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100).optional(),
  areaId: idSchema.optional(),
  trapType: z.enum(TRAP_TYPES).optional(),
  status: z.enum(TRAP_STATUSES).optional(),
});
export type TrapListQuery = z.output<typeof trapListQuerySchema>;

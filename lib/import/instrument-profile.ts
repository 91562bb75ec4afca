import { z } from 'zod';
import { TEXT_ENCODINGS } from './encoding';
import { LEVEL_UNITS, TEMPERATURE_UNITS } from './units';

/**
 * The instrument profile: how one meter model's export reads (BRIEF §3).
 * This schema is the JSON file users export and import, and the body the API
 * takes; `version` moves when a field changes meaning, so an old file is
 * refused with a clear message instead of being misread.
 *
 * Columns are 0-based indexes into the header row; `header` keeps the names
 * so the reader can check that a file really has this layout.
 */

export const PROFILE_FORMAT = 'plumeward.instrument-profile';
export const PROFILE_VERSION = 1;

const column = z.number().int().min(0).max(4095).describe('0-based column index in the header row');
const regexText = z
  .string()
  .min(1)
  .max(500)
  .refine(
    (s) => {
      try {
        new RegExp(s);
        return true;
      } catch {
        return false;
      }
    },
    { message: 'not a valid regular expression' },
  );
const zone = z
  .string()
  .min(1)
  .max(64)
  .nullable()
  .describe("IANA time zone of local times; null: the site's zone. Ignored for times that carry their own offset.");
const dateOrder = z.enum(['ymd', 'dmy', 'mdy']).describe('order of year, month and day in dates');

export const TimeSourceSchema = z
  .discriminatedUnion('kind', [
    z.object({
      kind: z.literal('datetime'),
      column: column.describe('column holding the date and time, or the date alone when timeColumn is set'),
      timeColumn: column.nullable().default(null).describe('separate time-of-day column, if the meter splits date and time'),
      order: dateOrder,
      zone,
    }),
    z.object({
      kind: z.literal('epoch'),
      column,
      unit: z.enum(['s', 'ms']).describe('seconds or milliseconds since 1970-01-01T00:00:00Z'),
    }),
    z.object({
      kind: z.literal('elapsed'),
      column,
      unit: z.enum(['s', 'ms']),
      startKey: z.string().min(1).describe('preamble key whose value is the start date and time'),
      startOrder: dateOrder,
      zone,
    }),
    z.object({
      kind: z.literal('index'),
      column: column.nullable().describe('sample-number column; null: the row order'),
      rateHz: z.number().positive().max(1e6).nullable().describe('fixed sample rate; null: read it from rateKey'),
      rateKey: z.string().min(1).nullable().describe('preamble key holding the rate ("20 Hz") or interval ("50 ms")'),
      startKey: z.string().min(1),
      startOrder: dateOrder,
      zone,
    }),
  ])
  .refine((t) => t.kind !== 'index' || t.rateHz !== null || t.rateKey !== null, {
    message: 'a sample-index time needs rateHz or rateKey',
  });

export const TagSourceSchema = z.discriminatedUnion('from', [
  z.object({ from: z.literal('column'), column }),
  z.object({
    from: z.literal('file-name'),
    pattern: regexText.describe('applied to the file (or zip entry) base name; the group named "tag", else the first group, else the whole match'),
  }),
  z.object({ from: z.literal('preamble'), key: z.string().min(1) }),
]);

const roleValues = {
  trapValues: z.array(z.string()).default([]).describe('values that mean the trap point (compared without case or accents)'),
  referenceValues: z.array(z.string()).min(1).describe('values that mean the reference point on the adjacent pipe'),
};

export const RoleSourceSchema = z.discriminatedUnion('from', [
  z.object({ from: z.literal('none') }).describe('every test is a trap test'),
  z.object({ from: z.literal('column'), column, ...roleValues }),
  z.object({ from: z.literal('tag-pattern'), pattern: regexText.describe('tags that match are reference points') }),
  z.object({ from: z.literal('preamble'), key: z.string().min(1), ...roleValues }),
]);

export const ReferenceLinkSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('same-tag') }).describe('the reference carries its trap\'s own tag'),
  z.object({ by: z.literal('tag-pattern'), pattern: regexText.describe('on the reference tag; group "trap" (or the first group) is the trap tag') }),
  z.object({ by: z.literal('preamble'), key: z.string().min(1).describe('preamble key naming the trap') }),
  z.object({ by: z.literal('previous-test') }).describe('the reference test right after its trap test'),
]);

export const InstrumentProfileSchema = z.object({
  format: z.literal(PROFILE_FORMAT),
  version: z.literal(PROFILE_VERSION),
  name: z.string().trim().min(1).max(120),
  description: z.string().max(2000).default(''),
  encoding: z.enum(['auto', ...TEXT_ENCODINGS]).default('auto'),
  delimiter: z.enum([',', ';', '\t', '|']),
  decimalMark: z.enum(['.', ',']),
  preambleKeys: z.array(z.string()).default([]).describe('keys of the `key: value` lines before the header'),
  header: z.array(z.string()).describe('header names as written; empty for a file without a header row'),
  unitsRow: z.boolean().default(false).describe('a row of units right after the header'),
  time: TimeSourceSchema,
  level: z.object({
    column,
    unit: z.enum(LEVEL_UNITS),
    vrefV: z.number().positive().default(1e-6).describe('reference voltage for RMS volts → dB (and dBµV rescaling)'),
  }),
  temperature: z.object({ column, unit: z.enum(TEMPERATURE_UNITS) }).nullable(),
  tag: TagSourceSchema,
  role: RoleSourceSchema,
  referenceLink: ReferenceLinkSchema,
  levelOffsetDb: z.number().min(-100).max(100).default(0).describe('calibration offset added to every level (dB)'),
  bands: z
    .object({ quietMaxDb: z.number().min(-20).max(150).optional(), liveSteamMinDb: z.number().min(-20).max(150).optional() })
    .nullable()
    .default(null)
    .describe("this meter model's calibrated band limits (dB); null: the trap-type defaults (BRIEF §4a precedence: type < profile < site)"),
  split: z
    .object({ minGapS: z.number().positive().default(5), gapPeriods: z.number().positive().default(10) })
    .default({ minGapS: 5, gapPeriods: 10 })
    .describe('a gap longer than max(minGapS, gapPeriods × sample period) starts a new test (BRIEF §4a)'),
  fingerprint: z.string().optional().describe('header fingerprint of the layout (see header-fingerprint.ts)'),
});

export type InstrumentProfile = z.infer<typeof InstrumentProfileSchema>;
export type InstrumentProfileInput = z.input<typeof InstrumentProfileSchema>;
export type TimeSource = z.infer<typeof TimeSourceSchema>;
export type TagSource = z.infer<typeof TagSourceSchema>;
export type RoleSource = z.infer<typeof RoleSourceSchema>;
export type ReferenceLink = z.infer<typeof ReferenceLinkSchema>;

/**
 * Parses a profile from JSON text or a value, with messages that name the
 * field. A file of another format or version says so before any field check.
 */
export function parseInstrumentProfile(input: unknown): { ok: true; profile: InstrumentProfile } | { ok: false; issues: string[] } {
  let value = input;
  if (typeof input === 'string') {
    try {
      value = JSON.parse(input);
    } catch (e) {
      return { ok: false, issues: [`not JSON: ${(e as Error).message}`] };
    }
  }
  if (value && typeof value === 'object') {
    const v = value as Record<string, unknown>;
    if (v.format !== PROFILE_FORMAT) return { ok: false, issues: [`format: expected "${PROFILE_FORMAT}", found ${JSON.stringify(v.format)}`] };
    if (v.version !== PROFILE_VERSION) return { ok: false, issues: [`version: this Plumeward reads instrument profile version ${PROFILE_VERSION}, the file is version ${JSON.stringify(v.version)}`] };
  }
  const r = InstrumentProfileSchema.safeParse(value);
  if (r.success) return { ok: true, profile: r.data };
  return { ok: false, issues: r.error.issues.map((i) => `${i.path.join('.') || '(profile)'}: ${i.message}`) };
}

/** The JSON Schema of the profile file, for the API document. */
export function instrumentProfileJsonSchema(): unknown {
  return z.toJSONSchema(InstrumentProfileSchema, { io: 'input' });
}

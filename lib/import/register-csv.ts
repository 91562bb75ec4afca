// Reads a trap register CSV (BRIEF §3): one row per trap, named columns, only tag, trap_type and
// pressure_barg required. Pure: text in, rows and problems out; nothing is written here.
import Papa from 'papaparse';
import { z } from 'zod';
import { trapInputSchema } from '@/lib/validation/trap';

export const REGISTER_COLUMNS = [
  'tag', 'area', 'location', 'trap_type', 'application', 'size_dn', 'orifice_mm',
  'pressure_barg', 'discharges_to', 'criticality', 'status',
] as const;
export type RegisterColumn = (typeof REGISTER_COLUMNS)[number];
export const REQUIRED_REGISTER_COLUMNS: readonly RegisterColumn[] = ['tag', 'trap_type', 'pressure_barg'];

/** Which field of the trap schema each column fills. */
const FIELD_OF: Record<Exclude<RegisterColumn, 'area'>, keyof z.input<typeof trapInputSchema>> = {
  tag: 'tag', location: 'location', trap_type: 'trapType', application: 'application', size_dn: 'sizeDn',
  orifice_mm: 'orificeMm', pressure_barg: 'pressureBarg', discharges_to: 'dischargesTo',
  criticality: 'criticality', status: 'status',
};
const NUMERIC = new Set<RegisterColumn>(['size_dn', 'orifice_mm', 'pressure_barg']);

export type RegisterProblem = {
  code: 'empty_file' | 'missing_column' | 'unknown_column' | 'duplicate_column' | 'wrong_field_count'
    | 'invalid_value' | 'duplicate_tag' | 'csv_syntax';
  /** 1-based line in the file where the row starts. */
  line: number;
  column?: string;
  message: string;
  /** Blocking problems stop the import; warnings (an ignored column) do not. */
  severity: 'error' | 'warning';
};

export type RegisterRow = {
  line: number;
  area: string | null;
  trap: z.output<typeof trapInputSchema>;
};

export type TrapField = keyof z.output<typeof trapInputSchema>;

export type RegisterParseResult = {
  columns: string[];
  /** The trap fields this file sets; an absent column leaves the stored value alone on update. */
  fields: TrapField[];
  /** Whether the file has an area column at all. */
  hasArea: boolean;
  rows: RegisterRow[];
  problems: RegisterProblem[];
};

function toNumber(raw: string): number | string {
  const n = Number(raw);
  return raw !== '' && Number.isFinite(n) ? n : raw;
}

export function parseRegisterCsv(text: string): RegisterParseResult {
  const problems: RegisterProblem[] = [];
  const source = text.replace(/^\uFEFF/, '');
  const records: { line: number; fields: string[] }[] = [];
  // Papa gives no line numbers; count newlines up to each row's start (meta.cursor is where it ended).
  let lineAtCursor = 1;
  let cursor = 0;
  Papa.parse<string[]>(source, {
    skipEmptyLines: 'greedy',
    step: (result) => {
      let start = cursor;
      while (start < source.length && (source[start] === '\n' || source[start] === '\r')) {
        if (source[start] === '\n') lineAtCursor++;
        start++;
      }
      for (const err of result.errors) {
        problems.push({ code: 'csv_syntax', line: lineAtCursor, message: err.message, severity: 'error' });
      }
      records.push({ line: lineAtCursor, fields: result.data });
      const end = result.meta.cursor;
      for (let i = start; i < end; i++) if (source[i] === '\n') lineAtCursor++;
      cursor = end;
    },
  });

  if (records.length === 0) {
    problems.push({ code: 'empty_file', line: 1, message: 'The file is empty: expected a header row naming the columns.', severity: 'error' });
    return { columns: [], fields: [], hasArea: false, rows: [], problems };
  }

  const header = records[0].fields.map((h) => h.trim().toLowerCase());
  const index = new Map<RegisterColumn, number>();
  header.forEach((name, i) => {
    if (!(REGISTER_COLUMNS as readonly string[]).includes(name)) {
      problems.push({ code: 'unknown_column', line: 1, column: name, severity: 'warning',
        message: `Column "${name}" is not a register column and is ignored. Known columns: ${REGISTER_COLUMNS.join(', ')}.` });
    } else if (index.has(name as RegisterColumn)) {
      problems.push({ code: 'duplicate_column', line: 1, column: name, severity: 'error', message: `Column "${name}" appears twice.` });
    } else {
      index.set(name as RegisterColumn, i);
    }
  });
  const missing = REQUIRED_REGISTER_COLUMNS.filter((c) => !index.has(c));
  for (const column of missing) {
    problems.push({ code: 'missing_column', line: 1, column, severity: 'error',
      message: `Required column "${column}" is missing. Required: ${REQUIRED_REGISTER_COLUMNS.join(', ')}.` });
  }
  const fields = [...index.keys()].filter((c) => c !== 'area').map((c) => FIELD_OF[c as keyof typeof FIELD_OF]);
  const hasArea = index.has('area');
  if (missing.length) return { columns: header, fields, hasArea, rows: [], problems };

  const rows: RegisterRow[] = [];
  const firstLineOfTag = new Map<string, number>();
  for (const { line, fields } of records.slice(1)) {
    if (fields.length !== header.length) {
      problems.push({ code: 'wrong_field_count', line, severity: 'error',
        message: `Expected ${header.length} fields as in the header, found ${fields.length}.` });
      continue;
    }
    const input: Record<string, unknown> = {};
    for (const [column, i] of index) {
      if (column === 'area') continue;
      const raw = fields[i].trim();
      if (raw === '') continue;
      input[FIELD_OF[column]] = NUMERIC.has(column) ? toNumber(raw) : raw;
    }
    const parsed = trapInputSchema.safeParse(input);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0]);
        const column = (Object.keys(FIELD_OF) as (keyof typeof FIELD_OF)[]).find((c) => FIELD_OF[c] === field) ?? field;
        const value = index.has(column as RegisterColumn) ? fields[index.get(column as RegisterColumn)!].trim() : '';
        problems.push({ code: 'invalid_value', line, column, severity: 'error',
          message: value ? `${issue.message} (found "${value}")` : issue.message });
      }
      continue;
    }
    const key = parsed.data.tag.toUpperCase();
    const seen = firstLineOfTag.get(key);
    if (seen !== undefined) {
      problems.push({ code: 'duplicate_tag', line, column: 'tag', severity: 'error',
        message: `Tag ${parsed.data.tag} already appears on line ${seen}.` });
      continue;
    }
    firstLineOfTag.set(key, line);
    const areaIndex = index.get('area');
    const area = areaIndex === undefined ? null : fields[areaIndex].trim() || null;
    rows.push({ line, area, trap: parsed.data });
  }
  return { columns: header, fields, hasArea, rows, problems };
}

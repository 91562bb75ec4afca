// Problems of the pipeline: the reader's and the zip reader's (lib/import), plus the few
// the pipeline itself finds. One shape for all, so that the command line and the server
// report them alike (see ./test-json.ts for the JSON form).

import type { ImportProblem, ProblemCode, ProblemSeverity } from '@/lib/import/problems';

export type PipelineProblemCode =
  | ProblemCode
  /** The input named on the command line does not exist or cannot be opened (edges only). */
  | 'file-missing'
  /** No instrument profile fits and detection found no time, level and tag columns. */
  | 'layout-unknown'
  /** A test that cannot be analysed (a single reading with no sample rate). */
  | 'test-not-analysed'
  /** A zip entry that is not a meter export (a photo, a system file) and was left out. */
  | 'zip-entry-skipped'
  /** Problems of the register CSV (lib/import/register-csv codes, with hyphens). */
  | 'register-empty-file'
  | 'register-missing-column'
  | 'register-unknown-column'
  | 'register-duplicate-column'
  | 'register-wrong-field-count'
  | 'register-invalid-value'
  | 'register-duplicate-tag'
  | 'register-csv-syntax';

export type PipelineProblem = Omit<ImportProblem, 'code'> & { code: PipelineProblemCode };

export interface ProblemPlace {
  file: string;
  entry?: string | null;
}

function placeWords(place: ProblemPlace, line?: number, column?: number | string): string {
  let s = place.entry ? `${place.file} › ${place.entry}` : place.file;
  if (line !== undefined) s += `, line ${line}`;
  if (column !== undefined) s += `, column ${column}`;
  return s;
}

/** A problem with the message written the way lib/import writes its own: place, what, what was expected. */
export function makeProblem(
  place: ProblemPlace,
  code: PipelineProblemCode,
  severity: ProblemSeverity,
  summary: string,
  where: { line?: number; column?: number; columnName?: string; expected?: string } = {},
): PipelineProblem {
  let message = `${placeWords(place, where.line, where.columnName ?? where.column)}: ${summary}`;
  if (where.expected !== undefined) message += `; expected ${where.expected}`;
  const p: PipelineProblem = { code, severity, message, file: place.file };
  if (place.entry) p.entry = place.entry;
  if (where.line !== undefined) p.line = where.line;
  if (where.column !== undefined) p.column = where.column;
  if (where.columnName !== undefined) p.columnName = where.columnName;
  if (where.expected !== undefined) p.expected = where.expected;
  return p;
}

export function isRefusal(p: { severity: ProblemSeverity }): boolean {
  return p.severity === 'error';
}

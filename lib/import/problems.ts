/**
 * Problems found while reading an upload. Nothing is dropped silently: every
 * skipped row, collapsed duplicate or refused file is reported here with where
 * it happened and what was expected, so the analyst can decide to accept it.
 */

export type ProblemSeverity =
  /** The file (or zip entry) was refused: it yields no tests. */
  | 'error'
  /** One row was skipped; the rest of the file was read. */
  | 'skipped'
  /** Data was kept but altered or is doubtful (duplicate collapsed, guessed setting). */
  | 'warning';

export type ProblemCode =
  // whole file
  | 'file-empty'
  | 'file-header-only'
  | 'file-not-text'
  | 'file-no-header'
  | 'file-too-many-problems'
  | 'file-no-readings'
  | 'encoding-invalid'
  | 'encoding-guessed'
  | 'header-mismatch'
  | 'profile-invalid'
  | 'time-zone-missing'
  | 'time-zone-unknown'
  | 'time-start-missing'
  | 'tag-missing'
  | 'csv-unterminated-quote'
  | 'csv-row-too-long'
  // one row
  | 'row-too-few-fields'
  | 'row-extra-fields'
  | 'csv-malformed-quote'
  | 'time-invalid'
  | 'level-invalid'
  | 'level-not-positive'
  | 'temperature-invalid'
  | 'tag-empty'
  | 'role-unknown'
  // series
  | 'time-duplicate'
  | 'time-backwards'
  | 'test-split-gap'
  | 'test-single-sample'
  | 'reference-unlinked'
  // zip
  | 'zip-empty'
  | 'zip-truncated'
  | 'zip-not-zip'
  | 'zip-too-many-entries'
  | 'zip-total-too-large'
  | 'zip-entry-ratio'
  | 'zip-entry-unsafe-name'
  | 'zip-entry-encrypted'
  | 'zip-entry-unsupported'
  | 'zip-entry-corrupt';

export interface ImportProblem {
  code: ProblemCode;
  severity: ProblemSeverity;
  /** Plain-words message that names the place and what was expected. */
  message: string;
  /** The uploaded file's name. */
  file: string;
  /** The entry's name inside a zip, when the file came from one. */
  entry?: string;
  /** 1-based physical line number in the decoded text. */
  line?: number;
  /** 1-based field number within the row. */
  column?: number;
  /** Header name of that column, when there is one. */
  columnName?: string;
  /** What the reader expected to find. */
  expected?: string;
  /** What it found instead (shortened). */
  found?: string;
}

export interface ProblemPlace {
  file: string;
  entry?: string;
}

export type ProblemFields = Omit<ImportProblem, 'file' | 'entry' | 'message'> & { message?: string };

function where(place: ProblemPlace, line?: number, column?: number, columnName?: string): string {
  let s = place.entry ? `${place.file} › ${place.entry}` : place.file;
  if (line !== undefined) s += `, line ${line}`;
  if (column !== undefined) s += `, column ${column}${columnName ? ` (${columnName})` : ''}`;
  return s;
}

/** Shortens a found value so a megabyte of garbage does not end up in a report. */
export function shorten(text: string, max = 60): string {
  const clean = text.replace(/[\u0000-\u001f]/g, (c) => `\\x${c.charCodeAt(0).toString(16).padStart(2, '0')}`);
  return clean.length > max ? `${clean.slice(0, max)}…` : clean;
}

/**
 * Collects problems with a cap per code: a file with a million bad rows must
 * not hold a million problem objects in memory. Past the cap the count goes on
 * and one summary problem says how many more there were.
 */
export class ProblemList {
  readonly items: ImportProblem[] = [];
  private readonly perCode = new Map<ProblemCode, number>();

  constructor(
    readonly place: ProblemPlace,
    private readonly capPerCode = 200,
  ) {}

  add(summary: string, fields: ProblemFields): void {
    const count = (this.perCode.get(fields.code) ?? 0) + 1;
    this.perCode.set(fields.code, count);
    if (count > this.capPerCode) return;
    const at = where(this.place, fields.line, fields.column, fields.columnName);
    let message = `${at}: ${summary}`;
    if (fields.expected !== undefined) message += `; expected ${fields.expected}`;
    if (fields.found !== undefined) message += `, found "${shorten(fields.found)}"`;
    const problem: ImportProblem = { ...fields, message, file: this.place.file };
    if (this.place.entry !== undefined) problem.entry = this.place.entry;
    this.items.push(problem);
  }

  count(code: ProblemCode): number {
    return this.perCode.get(code) ?? 0;
  }

  hasErrors(): boolean {
    return this.items.some((p) => p.severity === 'error');
  }

  /** The list with one summary line per code whose problems went past the cap. */
  finish(): ImportProblem[] {
    const out = [...this.items];
    for (const [code, count] of this.perCode) {
      if (count <= this.capPerCode) continue;
      const first = out.find((p) => p.code === code);
      out.push({
        code: 'file-too-many-problems',
        severity: 'warning',
        file: this.place.file,
        ...(this.place.entry !== undefined ? { entry: this.place.entry } : {}),
        message: `${where(this.place)}: ${count - this.capPerCode} more problems of kind "${code}" (${count} in all) are not listed one by one`,
        expected: first?.expected,
      });
    }
    return out;
  }
}

/**
 * A streaming delimited-text tokenizer over decoded text chunks.
 *
 * Why hand-written: the import target (BRIEF §7) is the whole pipeline within
 * 2× papaparse's own parse time, and STACK.md measured per-row objects and
 * per-field strings as the cost. This tokenizer hands each row to the caller
 * as offsets into the current buffer (no field strings are made unless the
 * caller asks), so numbers can be parsed straight from the text.
 *
 * Rules (RFC 4180, made lenient the way meter exports need):
 * - rows end at LF, CRLF or a lone CR;
 * - a field that starts with `"` is quoted: `""` inside is one quote, and
 *   delimiters and line breaks inside are data;
 * - a `"` inside an unquoted field is data (`37.8"N`);
 * - text after a closing quote before the delimiter is kept literally and the
 *   row is flagged `malformedQuote`, so the reader can report it.
 */

export const FIELD_QUOTED = 1;
export const FIELD_ESCAPED_QUOTES = 2;

export interface RowView {
  /** The buffer the offsets point into; valid only during the callback. */
  src: string;
  count: number;
  starts: Int32Array;
  ends: Int32Array;
  flags: Uint8Array;
  /** 1-based physical line where the row starts, and where it ends. */
  line: number;
  lastLine: number;
  /** Offsets of the row's raw text (without its line break). */
  rowStart: number;
  rowEnd: number;
  malformedQuote: boolean;
}

export type TokenizerProblem =
  | { code: 'csv-unterminated-quote'; line: number }
  | { code: 'csv-row-too-long'; line: number; length: number };

export interface TokenizerOptions {
  delimiter: string;
  /** Return false to stop tokenizing (the rest is ignored). */
  onRow: (row: RowView) => boolean | void;
  onProblem?: (p: TokenizerProblem) => void;
  /** A row longer than this is refused: no meter writes such rows, binary does. */
  maxRowChars?: number;
  /** Most fields per row kept; more are counted but not stored. */
  maxFields?: number;
}

const QUOTE = 34;
const LF = 10;
const CR = 13;

export function fieldText(row: RowView, i: number): string {
  if (i >= row.count) return '';
  const s = row.src.slice(row.starts[i], row.ends[i]);
  return row.flags[i] & FIELD_ESCAPED_QUOTES ? s.replace(/""/g, '"') : s;
}

/** The field's text without surrounding blanks. */
export function fieldTrimmed(row: RowView, i: number): string {
  return fieldText(row, i).trim();
}

export function rowTexts(row: RowView): string[] {
  const out: string[] = new Array(row.count);
  for (let i = 0; i < row.count; i++) out[i] = fieldText(row, i);
  return out;
}

export class CsvTokenizer {
  private carry = '';
  private line = 1;
  private stopped = false;
  private readonly delim: number;
  private readonly maxRowChars: number;
  private readonly maxFields: number;
  private readonly view: RowView;

  constructor(private readonly opts: TokenizerOptions) {
    if (opts.delimiter.length !== 1) throw new Error(`a delimiter is one character, not "${opts.delimiter}"`);
    this.delim = opts.delimiter.charCodeAt(0);
    this.maxRowChars = opts.maxRowChars ?? 1 << 20;
    this.maxFields = opts.maxFields ?? 4096;
    this.view = {
      src: '',
      count: 0,
      starts: new Int32Array(this.maxFields),
      ends: new Int32Array(this.maxFields),
      flags: new Uint8Array(this.maxFields),
      line: 1,
      lastLine: 1,
      rowStart: 0,
      rowEnd: 0,
      malformedQuote: false,
    };
  }

  get isStopped(): boolean {
    return this.stopped;
  }

  push(text: string): void {
    if (this.stopped) return;
    this.scan(this.carry.length ? this.carry + text : text, false);
  }

  end(): void {
    if (this.stopped) return;
    if (this.carry.length) this.scan(this.carry, true);
    this.carry = '';
  }

  private stop(): void {
    this.stopped = true;
    this.carry = '';
  }

  /** Scans complete rows of buf; the unfinished tail is kept for the next chunk. */
  private scan(buf: string, final: boolean): void {
    const n = buf.length;
    const delim = this.delim;
    const v = this.view;
    v.src = buf;
    const delimText = String.fromCharCode(delim);
    // Where the next quote, carriage return and delimiter are (-1: none left), kept ahead of i,
    // so each indexOf scans a stretch of the buffer once.
    let nextQuote = 0;
    let nextCr = 0;
    let nextDelim = 0;
    let i = 0;
    while (i < n) {
      const rowStart = i;
      let count = 0;
      let extraLines = 0;
      let malformed = false;
      let complete = false;
      let rowEnd = n;
      // Fast path, for the usual row with no quote and no lone CR: its line end and fields are
      // found with indexOf (native, and much faster than a loop over characters).
      const lf = buf.indexOf('\n', i);
      if (nextQuote >= 0 && nextQuote < i) nextQuote = buf.indexOf('"', i);
      if (nextCr >= 0 && nextCr < i) nextCr = buf.indexOf('\r', i);
      if (lf >= 0 && (nextQuote < 0 || nextQuote > lf) && (nextCr < 0 || nextCr >= lf - 1)) {
        rowEnd = nextCr === lf - 1 ? lf - 1 : lf;
        let j = i;
        for (;;) {
          if (nextDelim >= 0 && nextDelim < j) nextDelim = buf.indexOf(delimText, j);
          const end = nextDelim >= 0 && nextDelim < rowEnd ? nextDelim : rowEnd;
          if (count < this.maxFields) {
            v.starts[count] = j;
            v.ends[count] = end;
            v.flags[count] = 0;
          }
          count++;
          if (end === rowEnd) break;
          j = end + 1;
        }
        i = lf + 1;
        complete = true;
      } else fields: for (;;) {
        let start: number;
        let end: number;
        let flag = 0;
        if (i < n && buf.charCodeAt(i) === QUOTE) {
          let j = i + 1;
          let closeAt = -1;
          for (;;) {
            const q = buf.indexOf('"', j);
            if (q < 0) break;
            if (q + 1 < n && buf.charCodeAt(q + 1) === QUOTE) {
              flag |= FIELD_ESCAPED_QUOTES;
              j = q + 2;
              continue;
            }
            if (q + 1 >= n && !final) break; // the next chunk may begin with the second quote of a pair
            closeAt = q;
            break;
          }
          if (closeAt < 0) {
            if (!final) break fields; // unfinished: wait for more text
            this.opts.onProblem?.({ code: 'csv-unterminated-quote', line: this.line + extraLines });
            closeAt = n;
          }
          start = i + 1;
          end = closeAt;
          for (let k = buf.indexOf('\n', start); k >= 0 && k < end; k = buf.indexOf('\n', k + 1)) extraLines++;
          flag |= FIELD_QUOTED;
          i = Math.min(closeAt + 1, n);
          if (i < n) {
            const c = buf.charCodeAt(i);
            if (c !== delim && c !== LF && c !== CR) {
              // `"abc"x`: keep the whole thing literally, as a spreadsheet would show it.
              malformed = true;
              let j = i;
              while (j < n) {
                const d = buf.charCodeAt(j);
                if (d === delim || d === LF || d === CR) break;
                j++;
              }
              if (j >= n && !final) break fields;
              start = start - 1;
              end = j;
              flag = 0;
              i = j;
            }
          } else if (!final) break fields;
        } else {
          let j = i;
          while (j < n) {
            const c = buf.charCodeAt(j);
            if (c === delim || c === LF || c === CR) break;
            j++;
          }
          if (j >= n && !final) break fields;
          start = i;
          end = j;
          i = j;
        }
        if (count < this.maxFields) {
          v.starts[count] = start;
          v.ends[count] = end;
          v.flags[count] = flag;
        }
        count++;
        if (i >= n) {
          complete = true; // final chunk without a closing line break
          rowEnd = n;
          break;
        }
        const c = buf.charCodeAt(i);
        if (c === delim) {
          i++;
          if (i >= n && !final) break fields;
          continue;
        }
        rowEnd = i;
        if (c === CR) {
          if (i + 1 >= n && !final) break fields; // a CRLF may be split across chunks
          i++;
          if (i < n && buf.charCodeAt(i) === LF) i++;
        } else i++;
        complete = true;
        break;
      }
      if (!complete) {
        const tail = n - rowStart;
        if (tail > this.maxRowChars) {
          this.opts.onProblem?.({ code: 'csv-row-too-long', line: this.line, length: tail });
          this.stop();
          return;
        }
        this.carry = buf.slice(rowStart);
        return;
      }
      if (rowEnd - rowStart > this.maxRowChars) {
        this.opts.onProblem?.({ code: 'csv-row-too-long', line: this.line, length: rowEnd - rowStart });
        this.stop();
        return;
      }
      v.count = Math.min(count, this.maxFields);
      v.line = this.line;
      v.lastLine = this.line + extraLines;
      v.rowStart = rowStart;
      v.rowEnd = rowEnd;
      v.malformedQuote = malformed;
      this.line += extraLines + 1;
      if (this.opts.onRow(v) === false) {
        this.stop();
        return;
      }
    }
    this.carry = '';
  }
}

/** Tokenizes a whole string into string arrays (detection samples, tests). */
export function tokenizeAll(text: string, delimiter: string, maxRows = Infinity): { rows: string[][]; lines: number[] } {
  const rows: string[][] = [];
  const lines: number[] = [];
  const t = new CsvTokenizer({
    delimiter,
    onRow: (r) => {
      rows.push(rowTexts(r));
      lines.push(r.line);
      return rows.length < maxRows;
    },
  });
  t.push(text);
  t.end();
  return { rows, lines };
}

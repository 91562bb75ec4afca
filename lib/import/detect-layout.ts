import { detectColumn, type DetectedColumn } from './column-detect';
import { tokenizeAll } from './csv-tokenizer';
import { detectEncoding, ENCODING_SAMPLE_BYTES, type EncodingGuess } from './encoding';
import { headerFingerprint } from './header-fingerprint';
import { keyHasWord, PREAMBLE_KEY_WORDS, roleOfWord, wordsOf } from './header-vocabulary';
import { sniffBinary } from './binary-sniff';
import {
  PROFILE_FORMAT,
  PROFILE_VERSION,
  type InstrumentProfile,
  type ReferenceLink,
  type RoleSource,
  type TagSource,
  type TimeSource,
} from './instrument-profile';
import { parsePreamble, parseRate, type Preamble } from './preamble';
import { ProblemList, type ImportProblem } from './problems';
import { parseDateTimeText, type DateOrder } from './time-parse';
import type { LevelUnit, TemperatureUnit } from './units';

/**
 * Layout detection: from the first bytes of a file to a suggested instrument
 * profile, with a confidence per field, for the mapping wizard.
 */

export type Delimiter = ',' | ';' | '\t' | '|';
export const DELIMITERS: readonly Delimiter[] = [',', ';', '\t', '|'];

export interface DetectOptions {
  fileName: string;
  /** Entry name inside a zip, when the file came from one. */
  entry?: string;
  /** True when `bytes` is the whole file, not a prefix. Default: shorter than the sample size. */
  isWholeFile?: boolean;
}

export interface FieldSuggestion<T> {
  value: T;
  /** 0..1 */
  confidence: number;
  reason: string;
}

export interface SuggestedMapping {
  time: FieldSuggestion<TimeSource> | null;
  level: FieldSuggestion<{ column: number; unit: LevelUnit }> | null;
  temperature: FieldSuggestion<{ column: number; unit: TemperatureUnit }> | null;
  tag: FieldSuggestion<TagSource> | null;
  role: FieldSuggestion<RoleSource>;
  referenceLink: FieldSuggestion<ReferenceLink>;
}

/**
 * The shape of a file's layout, read from its first lines: encoding, delimiter, preamble,
 * header and units row, and the fingerprint they make. Enough to recognise a layout a
 * profile already reads — the import's usual case, so it is kept cheap: the first
 * SHAPE_SAMPLE_BYTES and SHAPE_SAMPLE_LINES. `detectLayout` starts from the same shape, so
 * both always give a file the same fingerprint.
 */
export interface LayoutShape {
  /** False when the file cannot be read as a meter export at all (see problems). */
  ok: boolean;
  encoding: EncodingGuess | null;
  delimiter: Delimiter;
  delimiterConfidence: number;
  preamble: Preamble;
  /** 1-based line of the header row; null when the file has none. */
  headerLine: number | null;
  header: string[];
  unitsRow: string[] | null;
  /** 0-based index (after any byte-order mark) of the line the data rows start on. */
  dataStartIndex: number;
  fingerprint: string;
  problems: ImportProblem[];
}

/** The full detection: the file's shape (below), and what each column holds. */
export interface LayoutDetection extends LayoutShape {
  decimalMark: '.' | ',';
  decimalMarkConfidence: number;
  columns: DetectedColumn[];
  suggestedMapping: SuggestedMapping | null;
  /** A complete profile from the suggestion, when time and level were found. */
  suggestedProfile: InstrumentProfile | null;
  /** The lowest confidence among the required fields. */
  confidence: number;
  preview: { line: number; fields: string[] }[];
}

/** How much of the file detection reads. */
export const DETECT_SAMPLE_BYTES = 256 * 1024;
const DETECT_SAMPLE_LINES = 2000;
const MAX_SAMPLE_ROWS = 500;
const PREVIEW_ROWS = 20;

const DELIMITER_CODES = DELIMITERS.map((d) => d.charCodeAt(0));

/** Field counts of a line split on each of DELIMITERS (in their order) in one pass, honouring double quotes; 0 for a blank line. */
function fieldCounts(line: string): number[] {
  if (!line.trim()) return [0, 0, 0, 0];
  const n = [1, 1, 1, 1];
  let inQuotes = false;
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 34) inQuotes = !inQuotes;
    else if (!inQuotes) {
      const k = DELIMITER_CODES.indexOf(c);
      if (k >= 0) n[k]++;
    }
  }
  return n;
}

function modeOf(counts: number[]): number {
  const freq = new Map<number, number>();
  for (const c of counts) if (c >= 2) freq.set(c, (freq.get(c) ?? 0) + 1);
  let best = 0;
  let bestN = 0;
  for (const [c, n] of freq) if (n > bestN || (n === bestN && c > best)) [best, bestN] = [c, n];
  return best;
}

function chooseDelimiter(lines: string[]): { delimiter: Delimiter; fields: number; confidence: number; reason: string; counts: number[] } {
  const perLine = lines.map(fieldCounts);
  const sep = /^\s*"?sep=(.)"?\s*$/i.exec(lines[0] ?? '');
  if (sep && (DELIMITERS as readonly string[]).includes(sep[1])) {
    const k = DELIMITERS.indexOf(sep[1] as Delimiter);
    const counts = perLine.map((c) => c[k]);
    return { delimiter: sep[1] as Delimiter, fields: modeOf(counts.slice(1)), confidence: 1, reason: `the first line says sep=${sep[1]}`, counts };
  }
  const scored = DELIMITERS.map((d, k) => {
    const counts = perLine.map((c) => c[k]);
    const mode = modeOf(counts);
    const score = mode >= 2 ? counts.filter((c) => c === mode).length : 0;
    return { d, mode, score, counts };
  }).sort((a, b) => b.score - a.score || b.mode - a.mode);
  const [best, second] = scored;
  const nonBlank = lines.filter((l) => l.trim()).length;
  if (best.score === 0) return { delimiter: ',', fields: 1, confidence: 0, reason: 'no line splits into fields on , ; tab or |', counts: [] };
  const clear = !second || second.score < best.score * 0.8 || second.mode < best.mode;
  const name = best.d === '\t' ? 'tab' : best.d;
  return {
    delimiter: best.d,
    fields: best.mode,
    confidence: Math.min(1, best.score / Math.max(1, nonBlank) + 0.2) * (clear ? 1 : 0.7),
    reason: `${best.score} of ${nonBlank} lines split into ${best.mode} fields on "${name}"`,
    counts: best.counts,
  };
}

const NUMBERISH = /^\s*[+-]?(\d+([.,]\d+)?|[.,]\d+)([eE][+-]?\d+)?\s*$/;
const DATEISH = /^\s*\d{1,4}[-./]\d{1,2}[-./]\d{1,4}|^\s*\d{1,2}:\d{2}/;

function looksLikeHeader(fields: string[]): boolean {
  const filled = fields.filter((f) => f.trim());
  if (filled.length === 0) return false;
  const dataLike = filled.filter((f) => NUMBERISH.test(f) || DATEISH.test(f)).length;
  return dataLike / filled.length < 0.34;
}

const UNIT_TOKENS = new Set(['db', 'dbuv', 'dbµv', 'mv', 'v', '°c', '°f', 'c', 'f', 'k', 's', 'ms', 'hz', 'degc', 'degf', 'µv', 'uv', 'vrms', 'mvrms']);

function looksLikeUnitsRow(fields: string[]): boolean {
  const filled = fields.filter((f) => f.trim());
  if (filled.length === 0) return false;
  return filled.every((f) => f.trim().length <= 10 && !NUMBERISH.test(f)) && filled.some((f) => wordsOf(f.replace(/[[\]()]/g, '')).some((w) => UNIT_TOKENS.has(w)) || /°/.test(f));
}

function chooseDecimalMark(rows: string[][], delimiter: Delimiter): { mark: '.' | ','; confidence: number } {
  let comma = 0;
  let dot = 0;
  for (const r of rows)
    for (const f of r) {
      if (/^\s*[+-]?\d+,\d+\s*$/.test(f)) comma++;
      else if (/^\s*[+-]?\d+\.\d+\s*$/.test(f)) dot++;
    }
  if (comma === 0 && dot === 0) return { mark: delimiter === ',' ? '.' : '.', confidence: 0.5 };
  if (comma > dot) return { mark: ',', confidence: comma / (comma + dot) };
  return { mark: '.', confidence: dot / (comma + dot) };
}

const TAG_IN_TEXT = /(?<tag>[A-Za-z]{1,6}(?:-[A-Za-z0-9]+){1,4})/;
const REFERENCE_SUFFIX = '(?:ref|pipe|rohr|referenz|tuyau|tubo|ref\\.|leiding)';

function looksLikeTag(v: string): boolean {
  return /^[\p{L}][\p{L}\d]*(?:[-_./ ]?[\p{L}\d]+)*$/u.test(v.trim()) && /\d/.test(v) && v.trim().length <= 40 && !roleOfWord(v);
}

function suggestTime(columns: DetectedColumn[], preamble: Preamble): FieldSuggestion<TimeSource> | null {
  const by = (k: DetectedColumn['kind']) => columns.filter((c) => c.kind === k).sort((a, b) => b.confidence - a.confidence)[0];
  const startEntry = preamble.entries.find((e) => keyHasWord(e.key, PREAMBLE_KEY_WORDS.start) && startOrderOf(e.value) !== null);
  const startOrder = startEntry ? startOrderOf(startEntry.value)! : 'ymd';
  const dt = by('datetime');
  if (dt) {
    return {
      value: { kind: 'datetime', column: dt.index, timeColumn: null, order: dt.dateOrder ?? 'ymd', zone: null },
      confidence: dt.confidence,
      reason: `${dt.name || `column ${dt.index + 1}`}: ${dt.reason}${dt.zoneInText ? '; the times carry their own offset' : "; local times, read in the site's time zone"}`,
    };
  }
  const date = by('date');
  const tod = by('time-of-day');
  if (date && tod) {
    return {
      value: { kind: 'datetime', column: date.index, timeColumn: tod.index, order: date.dateOrder ?? 'ymd', zone: null },
      confidence: Math.min(date.confidence, tod.confidence),
      reason: `date in "${date.name}", time of day in "${tod.name}"`,
    };
  }
  const ep = by('epoch');
  if (ep) return { value: { kind: 'epoch', column: ep.index, unit: ep.epochUnit ?? 's' }, confidence: ep.confidence, reason: ep.reason };
  const el = by('elapsed');
  if (el && startEntry) {
    return {
      value: { kind: 'elapsed', column: el.index, unit: el.elapsedUnit ?? 's', startKey: startEntry.key, startOrder, zone: null },
      confidence: Math.min(el.confidence, 0.85),
      reason: `"${el.name}" counts ${el.elapsedUnit ?? 's'} from the start "${startEntry.key}: ${startEntry.value}"`,
    };
  }
  const rateEntry = preamble.entries.find(
    (e) => (keyHasWord(e.key, PREAMBLE_KEY_WORDS.rate) && parseRate(e.value, false) > 0) || (keyHasWord(e.key, PREAMBLE_KEY_WORDS.interval) && parseRate(e.value, true) > 0),
  );
  const ix = by('index');
  if (startEntry && rateEntry) {
    return {
      value: { kind: 'index', column: ix ? ix.index : null, rateHz: null, rateKey: rateEntry.key, startKey: startEntry.key, startOrder, zone: null },
      confidence: ix ? 0.8 : 0.6,
      reason: `${ix ? `sample numbers in "${ix.name}"` : 'row order'} at the rate "${rateEntry.key}: ${rateEntry.value}" from "${startEntry.key}: ${startEntry.value}"`,
    };
  }
  return null;
}

function startOrderOf(value: string): DateOrder | null {
  for (const o of ['ymd', 'dmy', 'mdy'] as const) if (!Number.isNaN(parseDateTimeText(value, o).wallMs)) return o;
  return null;
}

function suggestTag(columns: DetectedColumn[], preamble: Preamble, baseName: string): FieldSuggestion<TagSource> | null {
  const col = columns.filter((c) => c.kind === 'tag').sort((a, b) => b.confidence - a.confidence)[0];
  if (col) return { value: { from: 'column', column: col.index }, confidence: col.confidence, reason: `tags in "${col.name}"` };
  const key = preamble.entries.find((e) => keyHasWord(e.key, PREAMBLE_KEY_WORDS.tag) && !keyHasWord(e.key, PREAMBLE_KEY_WORDS.link) && looksLikeTag(e.value));
  if (key) return { value: { from: 'preamble', key: key.key }, confidence: 0.8, reason: `the preamble line "${key.key}: ${key.value}"` };
  const m = TAG_IN_TEXT.exec(baseName);
  if (m) return { value: { from: 'file-name', pattern: TAG_IN_TEXT.source }, confidence: 0.5, reason: `the file name holds "${m.groups!.tag}"` };
  return null;
}

function suggestRole(columns: DetectedColumn[], preamble: Preamble, tagValues: string[]): FieldSuggestion<RoleSource> {
  const col = columns.find((c) => c.kind === 'role');
  if (col) {
    const refs = col.distinct.filter((v) => roleOfWord(v) === 'reference');
    const traps = col.distinct.filter((v) => roleOfWord(v) === 'trap');
    if (refs.length) return { value: { from: 'column', column: col.index, trapValues: traps, referenceValues: refs }, confidence: col.confidence, reason: `point roles in "${col.name}": ${col.distinct.join(', ')}` };
  }
  const key = preamble.entries.find((e) => keyHasWord(e.key, PREAMBLE_KEY_WORDS.role) && roleOfWord(e.value) !== null);
  if (key) {
    const ref = roleOfWord(key.value) === 'reference' ? [key.value] : [];
    return {
      value: { from: 'preamble', key: key.key, trapValues: roleOfWord(key.value) === 'trap' ? [key.value] : [], referenceValues: ref.length ? ref : ['reference', 'pipe'] },
      confidence: 0.7,
      reason: `the preamble line "${key.key}: ${key.value}"`,
    };
  }
  const suffix = new RegExp(`[-_ ]${REFERENCE_SUFFIX}$`, 'i');
  if (tagValues.some((t) => suffix.test(t))) return { value: { from: 'tag-pattern', pattern: suffix.source }, confidence: 0.7, reason: 'some tags end in a reference suffix' };
  return { value: { from: 'none' }, confidence: 0.5, reason: 'no point-role column or key: every test is a trap test' };
}

function suggestLink(role: RoleSource, preamble: Preamble, tagKey: string | null, referencesShareTrapTags: boolean | null): FieldSuggestion<ReferenceLink> {
  if (role.from === 'tag-pattern') return { value: { by: 'tag-pattern', pattern: `^(?<trap>.+?)[-_ ]${REFERENCE_SUFFIX}$` }, confidence: 0.7, reason: 'the trap tag is the reference tag without its suffix' };
  if (role.from === 'preamble') {
    const key = preamble.entries.find((e) => e.key !== tagKey && keyHasWord(e.key, PREAMBLE_KEY_WORDS.link) && looksLikeTag(e.value));
    if (key) return { value: { by: 'preamble', key: key.key }, confidence: 0.7, reason: `the preamble line "${key.key}: ${key.value}" names the trap` };
    return { value: { by: 'previous-test' }, confidence: 0.4, reason: 'no key names the trap: a reference belongs to the test before it' };
  }
  if (role.from === 'column') {
    if (referencesShareTrapTags === false) return { value: { by: 'previous-test' }, confidence: 0.6, reason: 'reference rows carry tags of their own: each belongs to the trap test before it' };
    return { value: { by: 'same-tag' }, confidence: referencesShareTrapTags ? 0.85 : 0.5, reason: "references carry their trap's tag" };
  }
  return { value: { by: 'same-tag' }, confidence: 1, reason: 'no reference points' };
}

function baseNameOf(opts: DetectOptions): string {
  const n = opts.entry ?? opts.fileName;
  return n.slice(n.lastIndexOf('/') + 1);
}

/** The detection of a file whose shape could not be read: the shape's findings, nothing about columns. */
function failedDetection(shape: LayoutShape): LayoutDetection {
  return {
    ...shape,
    ok: false,
    decimalMark: '.',
    decimalMarkConfidence: 0,
    columns: [],
    suggestedMapping: null,
    suggestedProfile: null,
    confidence: 0,
    preview: [],
  };
}

/**
 * A preamble, the header and a hundred-odd rows: enough to settle the delimiter and find the
 * header. Its cost is paid for every file, so on a day of small files it shows: 400 lines of
 * 64 KiB cost a sixth of reading the file. The encoding is still judged on the first 64 KiB.
 */
export const SHAPE_SAMPLE_BYTES = 16 * 1024;
const SHAPE_SAMPLE_LINES = 150;
/** Rows that settle the column count of a file without a header. */
const WIDTH_ROWS = 50;

function failedShape(problems: ProblemList, encoding: EncodingGuess | null): LayoutShape {
  return {
    ok: false, encoding, delimiter: ',', delimiterConfidence: 0, preamble: { entries: [], otherLines: [] },
    headerLine: null, header: [], unitsRow: null, dataStartIndex: 0, fingerprint: '', problems: problems.finish(),
  };
}

/**
 * The sample's text after any byte-order mark: all of it when `bytes` is the whole file and
 * within `limit`; else the first `limit` bytes, cut after their last whole line.
 */
function sampleText(bytes: Uint8Array, encoding: EncodingGuess, isWholeFile: boolean, limit: number): string {
  const whole = isWholeFile && bytes.length <= limit;
  const text = new TextDecoder(encoding.encoding === 'windows-1252' ? 'windows-1252' : encoding.encoding)
    .decode(bytes.subarray(encoding.bomLength, whole ? bytes.length : Math.min(bytes.length, limit)));
  return whole ? text : text.slice(0, Math.max(text.lastIndexOf('\n'), 0));
}

export function detectShape(bytes: Uint8Array, opts: DetectOptions): LayoutShape {
  const problems = new ProblemList({ file: opts.fileName, ...(opts.entry !== undefined ? { entry: opts.entry } : {}) });
  if (bytes.length === 0) {
    problems.add('the file is empty (0 bytes)', { code: 'file-empty', severity: 'error', expected: 'a header row and data rows' });
    return failedShape(problems, null);
  }
  const isWholeFile = opts.isWholeFile ?? bytes.length <= DETECT_SAMPLE_BYTES;
  const encoding = detectEncoding(bytes, isWholeFile && bytes.length <= ENCODING_SAMPLE_BYTES);
  const binary = sniffBinary(bytes.subarray(0, SHAPE_SAMPLE_BYTES), encoding.encoding.startsWith('utf-16'));
  if (binary) {
    problems.add(`this is ${binary}, not a meter export`, { code: 'file-not-text', severity: 'error', expected: 'delimited text (CSV, semicolon, tab or pipe separated)' });
    return failedShape(problems, encoding);
  }
  if (encoding.encoding === 'windows-1252') problems.add(`encoding guessed: ${encoding.reason}`, { code: 'encoding-guessed', severity: 'warning', expected: 'UTF-8 or a byte-order mark' });

  const text = sampleText(bytes, encoding, isWholeFile, SHAPE_SAMPLE_BYTES);
  if (!text.trim()) {
    problems.add('the file holds only blank lines', { code: 'file-empty', severity: 'error', expected: 'a header row and data rows' });
    return failedShape(problems, encoding);
  }
  const lines = text.split(/\r\n|\n|\r/, SHAPE_SAMPLE_LINES);
  const delim = chooseDelimiter(lines);
  if (delim.confidence === 0) {
    problems.add('no delimited rows found', { code: 'file-no-header', severity: 'error', expected: 'rows of fields separated by comma, semicolon, tab or |', found: lines.find((l) => l.trim()) ?? '' });
    return failedShape(problems, encoding);
  }
  const d = delim.delimiter;
  const counts = delim.counts;
  const near = (c: number) => c >= 2 && Math.abs(c - delim.fields) <= 1;
  let h = -1;
  for (let i = 0; i < lines.length; i++) {
    if (near(counts[i]) && (i + 1 >= lines.length || near(counts[i + 1]) || !lines[i + 1].trim())) {
      h = i;
      break;
    }
  }
  if (h < 0) h = counts.findIndex((c) => c >= 2);
  const headerFields = tokenizeAll(lines[h], d).rows[0] ?? [];
  const hasHeader = looksLikeHeader(headerFields);
  const preamble = parsePreamble(
    lines.slice(0, h).map((t, i) => ({ line: i + 1, text: t })).filter((l) => !/^\s*"?sep=.\s*"?$/i.test(l.text)),
    d,
  );
  let dataStart = hasHeader ? h + 1 : h;
  let unitsRow: string[] | null = null;
  if (hasHeader && dataStart < lines.length) {
    const u = tokenizeAll(lines[dataStart], d).rows[0] ?? [];
    if (looksLikeUnitsRow(u)) {
      unitsRow = u.map((s) => s.trim());
      dataStart++;
    }
  }
  const header = hasHeader ? headerFields.map((s) => s.trim()) : [];
  const firstRows = dataRows(lines.slice(dataStart), d, dataStart, WIDTH_ROWS).rows;
  if (firstRows.length === 0) {
    problems.add(hasHeader ? 'the file has a header row but no data rows' : 'the file has no data rows', {
      code: 'file-header-only',
      severity: 'error',
      line: h + 1,
      expected: 'data rows after the header',
    });
  }
  const width = Math.max(header.length, ...firstRows.map((r) => r.length));
  return {
    ok: firstRows.length > 0,
    encoding,
    delimiter: d,
    delimiterConfidence: delim.confidence,
    preamble,
    headerLine: hasHeader ? h + 1 : null,
    header,
    unitsRow,
    dataStartIndex: dataStart,
    fingerprint: headerFingerprint({ delimiter: d, header, preambleKeys: preamble.entries.map((e) => e.key), unitsRow: unitsRow !== null, columnCount: width }),
    problems: problems.finish(),
  };
}

/** Non-blank data rows through the real tokenizer (so quoted line breaks count right), with their 1-based lines. */
function dataRows(lines: string[], d: Delimiter, firstIndex: number, max: number): { rows: string[][]; rowLines: number[] } {
  const tok = tokenizeAll(lines.join('\n'), d, max * 2);
  const rows: string[][] = [];
  const rowLines: number[] = [];
  tok.rows.forEach((r, i) => {
    if (r.length === 1 && !r[0].trim()) return;
    if (rows.length < max) {
      rows.push(r);
      rowLines.push(tok.lines[i] + firstIndex);
    }
  });
  return { rows, rowLines };
}

/**
 * The full detection, for the mapping wizard: the shape, then each column's kind and unit
 * from up to MAX_SAMPLE_ROWS data rows of the first DETECT_SAMPLE_BYTES, and a suggested
 * mapping and profile.
 */
export function detectLayout(bytes: Uint8Array, opts: DetectOptions): LayoutDetection {
  const shape = detectShape(bytes, opts);
  if (!shape.ok) return failedDetection(shape);
  const isWholeFile = opts.isWholeFile ?? bytes.length <= DETECT_SAMPLE_BYTES;
  const encoding = shape.encoding!; // a readable shape always has one
  const lines = sampleText(bytes, encoding, isWholeFile, DETECT_SAMPLE_BYTES).split(/\r\n|\n|\r/, DETECT_SAMPLE_LINES);
  const { rows, rowLines } = dataRows(lines.slice(shape.dataStartIndex), shape.delimiter, shape.dataStartIndex, MAX_SAMPLE_ROWS);
  const { header, unitsRow, preamble, fingerprint, delimiter: d } = shape;
  const width = Math.max(header.length, ...rows.slice(0, WIDTH_ROWS).map((r) => r.length));
  const decimal = chooseDecimalMark(rows, d);
  const columns: DetectedColumn[] = [];
  for (let i = 0; i < width; i++) {
    const name = header[i] ?? '';
    columns.push(detectColumn(i, name, unitsRow?.[i] || null, rows.map((r) => (r[i] ?? '').trim()), decimal.mark));
  }

  const baseName = baseNameOf(opts);
  const time = suggestTime(columns, preamble);
  const levelCol = columns.filter((c) => c.kind === 'level').sort((a, b) => b.confidence - a.confidence)[0];
  const tempCol = columns.filter((c) => c.kind === 'temperature').sort((a, b) => b.confidence - a.confidence)[0];
  const tag = suggestTag(columns, preamble, baseName);
  const tagValues = tag?.value.from === 'column' ? [...new Set(rows.map((r) => (r[(tag.value as { column: number }).column] ?? '').trim()))] : [];
  const role = suggestRole(columns, preamble, tagValues);
  let shared: boolean | null = null;
  if (role.value.from === 'column' && tag?.value.from === 'column') {
    const rc = role.value.column;
    const tc = tag.value.column;
    const refs = new Set(role.value.referenceValues.map((v) => v.trim()));
    const trapTags = new Set<string>();
    const refTags = new Set<string>();
    for (const r of rows) ((refs.has((r[rc] ?? '').trim()) ? refTags : trapTags)).add((r[tc] ?? '').trim());
    if (refTags.size) shared = [...refTags].some((t) => trapTags.has(t));
  }
  const link = suggestLink(role.value, preamble, tag?.value.from === 'preamble' ? tag.value.key : null, shared);
  const mapping: SuggestedMapping = {
    time,
    level: levelCol ? { value: { column: levelCol.index, unit: levelCol.levelUnit ?? 'dB' }, confidence: levelCol.confidence, reason: `"${levelCol.name}": ${levelCol.reason}` } : null,
    temperature: tempCol ? { value: { column: tempCol.index, unit: tempCol.temperatureUnit ?? 'C' }, confidence: tempCol.confidence, reason: `"${tempCol.name}": ${tempCol.reason}` } : null,
    tag,
    role,
    referenceLink: link,
  };
  const required = [shape.delimiterConfidence, time?.confidence ?? 0, mapping.level?.confidence ?? 0, tag?.confidence ?? 0];
  let suggestedProfile: InstrumentProfile | null = null;
  if (time && mapping.level && tag) {
    suggestedProfile = {
      format: PROFILE_FORMAT,
      version: PROFILE_VERSION,
      name: `Detected layout of ${baseName}`,
      description: '',
      encoding: encoding.encoding,
      delimiter: d,
      decimalMark: decimal.mark,
      preambleKeys: preamble.entries.map((e) => e.key),
      header,
      unitsRow: unitsRow !== null,
      time: time.value,
      level: { column: mapping.level.value.column, unit: mapping.level.value.unit, vrefV: 1e-6 },
      temperature: mapping.temperature ? mapping.temperature.value : null,
      tag: tag.value,
      role: role.value,
      referenceLink: link.value,
      levelOffsetDb: 0,
      bands: null,
      split: { minGapS: 5, gapPeriods: 10 },
      fingerprint,
    };
  }
  return {
    ...shape,
    ok: true,
    decimalMark: decimal.mark,
    decimalMarkConfidence: decimal.confidence,
    columns,
    suggestedMapping: mapping,
    suggestedProfile,
    confidence: Math.min(...required),
    preview: rows.slice(0, PREVIEW_ROWS).map((fields, i) => ({ line: rowLines[i], fields })),
  };
}


import { sniffBinary } from './binary-sniff';
import { CsvTokenizer, fieldText, type RowView } from './csv-tokenizer';
import { bomOf, createDecoder, detectEncoding, EncodingError, ENCODING_SAMPLE_BYTES, type StreamingDecoder, type TextEncodingName } from './encoding';
import { normaliseWord } from './header-vocabulary';
import type { InstrumentProfile } from './instrument-profile';
import type { NormalisedTest, PointRole } from './normalised-test';
import { COMMA, DOT, parseDecimal } from './number-parse';
import { parsePreambleLine, parseRate, preambleValue, type PreambleEntry } from './preamble';
import { ProblemList, type ImportProblem } from './problems';
import { createReferenceLinker, compileTagRegex, firstGroup } from './reference-link';
import { SeriesBuilder } from './series-builder';
import { createCursor, describeDateOrder, parseDateOnly, parseDateTime, parseDateTimeText, parseTimeOnly } from './time-parse';
import { createWallToUtc, isKnownTimeZone } from './time-zone';
import { levelConverter, temperatureConverter } from './units';

/**
 * The reader: bytes + an instrument profile → normalised tests. It is fed
 * chunks (`createTestReader().push`) or a whole buffer (`readTests`), keeps no
 * text beyond the row in progress, and turns each row straight into typed
 * arrays, so a 100 MB file is read with memory proportional to its readings,
 * not its text.
 */

export interface ReadOptions {
  fileName: string;
  /** Entry name inside a zip. */
  entry?: string;
  /** Folder names of the zip path, kept on each test. */
  hints?: string[];
  /** IANA zone for local times when the profile leaves it to the site. */
  timeZone?: string;
  /**
   * Called with each test as soon as it is complete (then it is not kept in
   * the result), so a long day file needs memory for one test at a time. If
   * the result then holds an "error" problem, the file failed: discard the
   * tests already handed out (a file that fails writes nothing).
   */
  onTest?: (test: NormalisedTest) => void;
  /** Problems listed one by one per code before they are only counted. */
  maxProblemsPerCode?: number;
}

export interface RowCounts {
  /** Physical lines read. */
  lines: number;
  /** Data rows (after header, units row and blank lines). */
  dataRows: number;
  /** Data rows that became readings. */
  readings: number;
  skipped: number;
  blank: number;
  duplicates: number;
  /** Rows kept with no temperature (blank cell). */
  missingTemperature: number;
}

export interface ReadResult {
  /** Empty when the file was refused (a problem with severity "error"). */
  tests: NormalisedTest[];
  problems: ImportProblem[];
  rowCounts: RowCounts;
  preamble: PreambleEntry[];
  encoding: TextEncodingName | null;
}

export interface TestReader {
  push(bytes: Uint8Array): void;
  end(): ReadResult;
}

type Phase = 'preamble' | 'units' | 'data' | 'stopped';

const MAX_PREAMBLE_LINES = 200;

function trimmedHeader(names: readonly string[]): string[] {
  const out = names.map(normaliseWord);
  while (out.length && out[out.length - 1] === '') out.pop();
  return out;
}

function baseName(opts: ReadOptions): string {
  const n = opts.entry ?? opts.fileName;
  return n.slice(Math.max(n.lastIndexOf('/'), n.lastIndexOf('\\')) + 1);
}

export function createTestReader(profile: InstrumentProfile, opts: ReadOptions): TestReader {
  const problems = new ProblemList({ file: opts.fileName, ...(opts.entry !== undefined ? { entry: opts.entry } : {}) }, opts.maxProblemsPerCode ?? 200);
  const counts: RowCounts = { lines: 0, dataRows: 0, readings: 0, skipped: 0, blank: 0, duplicates: 0, missingTemperature: 0 };
  const tests: NormalisedTest[] = [];
  const preamble: PreambleEntry[] = [];
  const source = { file: opts.fileName, ...(opts.entry !== undefined ? { entry: opts.entry } : {}), hints: opts.hints ?? [] };
  const expectedHeader = trimmedHeader(profile.header);
  const header = profile.header;
  const colName = (i: number) => header[i] || undefined;
  const mark = profile.decimalMark === ',' ? COMMA : DOT;
  const toDb = levelConverter(profile.level.unit, profile.level.vrefV, profile.levelOffsetDb);
  const toC = profile.temperature ? temperatureConverter(profile.temperature.unit) : null;
  const time = profile.time;
  const cur = createCursor();

  let encoding: TextEncodingName | null = profile.encoding === 'auto' ? null : profile.encoding;
  let decoder: StreamingDecoder | null = null;
  let head: Uint8Array | null = new Uint8Array(0); // bytes held until the encoding is known
  let totalBytes = 0;
  let phase: Phase = 'preamble';
  let failed = false;
  let nonBlankLines = 0;

  // Set once the header is read.
  let neededFields = 0;
  let toUtc: (wallMs: number) => number = (w) => w;
  let startMs = NaN;
  let rateHz = NaN;
  let fixedTag: string | null = null;
  let fixedRole: PointRole | null = null;
  let rowIndex = 0;

  // Role values compared as normalised words.
  const roleWords = new Map<string, PointRole>();
  if (profile.role.from === 'column' || profile.role.from === 'preamble') {
    for (const v of profile.role.trapValues) roleWords.set(normaliseWord(v), 'trap');
    for (const v of profile.role.referenceValues) roleWords.set(normaliseWord(v), 'reference');
  }
  const roleExpected =
    profile.role.from === 'column' || profile.role.from === 'preamble'
      ? `one of ${[...profile.role.trapValues, ...profile.role.referenceValues].map((v) => `"${v}"`).join(', ')}`
      : '';
  const refTagRegex = profile.role.from === 'tag-pattern' ? compileTagRegex(profile.role.pattern) : null;
  const roleOfTag = new Map<string, PointRole>();

  let builder: SeriesBuilder | null = null;
  let lastRoleText = '';
  let lastRole: PointRole = 'trap';
  const gapFloorMs = profile.split.minGapS * 1000;
  const linker = createReferenceLinker(profile.referenceLink, problems);

  type Fields = Omit<Parameters<ProblemList['add']>[1], 'severity'>;
  const fail = (summary: string, fields: Fields) => {
    problems.add(summary, { ...fields, severity: 'error' });
    failed = true;
    phase = 'stopped';
  };
  const skip = (summary: string, fields: Fields) => {
    counts.skipped++;
    problems.add(summary, { ...fields, severity: 'skipped' });
  };

  const closeTest = () => {
    if (!builder || builder.n === 0) {
      builder = null;
      return;
    }
    const knownRate = time.kind === 'index' ? rateHz : null;
    const { test, notes } = builder.finish(source, knownRate);
    for (const [kept, dropped] of notes.duplicates) {
      problems.add(`a reading with the same time as line ${kept} was dropped`, { code: 'time-duplicate', severity: 'warning', line: dropped, expected: 'one reading per time' });
    }
    counts.duplicates += notes.duplicateCount;
    counts.readings -= notes.duplicateCount;
    if (notes.duplicateCount > notes.duplicates.length) {
      problems.add(`${notes.duplicateCount - notes.duplicates.length} more readings with repeated times were dropped in the test of ${test.tag} (lines ${test.source.firstLine}–${test.source.lastLine})`, {
        code: 'time-duplicate',
        severity: 'warning',
        line: test.source.firstLine,
      });
    }
    if (test.sampleCount === 1) {
      problems.add(`the test of ${test.tag} has a single reading`, { code: 'test-single-sample', severity: 'warning', line: test.source.firstLine, expected: 'a series of readings' });
    }
    linker.link(test);
    if (opts.onTest) opts.onTest(test);
    else tests.push(test);
    builder = null;
  };

  function onHeaderRead(): boolean {
    neededFields = 1 + Math.max(
      profile.level.column,
      profile.temperature?.column ?? 0,
      'column' in time && time.column !== null ? time.column : 0,
      time.kind === 'datetime' && time.timeColumn !== null ? time.timeColumn : 0,
      profile.tag.from === 'column' ? profile.tag.column : 0,
      profile.role.from === 'column' ? profile.role.column : 0,
    );
    const zoneName = 'zone' in time ? (time.zone ?? opts.timeZone ?? null) : 'UTC';
    const needsZone = time.kind !== 'epoch';
    if (needsZone) {
      if (!zoneName) {
        // ISO times with offsets need no zone; find out on the first row instead of refusing here.
        toUtc = (w) => {
          fail('the times carry no offset and neither the profile nor the site names a time zone', { code: 'time-zone-missing', expected: 'an IANA time zone such as Europe/London' });
          return w;
        };
      } else if (!isKnownTimeZone(zoneName)) {
        fail(`unknown time zone "${zoneName}"`, { code: 'time-zone-unknown', expected: 'an IANA time zone such as Europe/London' });
        return false;
      } else toUtc = createWallToUtc(zoneName);
    }
    if (time.kind === 'elapsed' || time.kind === 'index') {
      const v = preambleValue(preamble, time.startKey);
      const parsed = v !== undefined ? parseDateTimeText(v, time.startOrder) : null;
      if (!parsed || Number.isNaN(parsed.wallMs)) {
        fail(v === undefined ? `the preamble has no "${time.startKey}" line` : `the start time "${v}" cannot be read`, {
          code: 'time-start-missing',
          expected: `a preamble line "${time.startKey}: " with ${describeDateOrder(time.startOrder)}`,
        });
        return false;
      }
      startMs = Number.isNaN(parsed.zoneOffsetMs) ? toUtc(parsed.wallMs) : parsed.wallMs - parsed.zoneOffsetMs;
      if (failed) return false;
    }
    if (time.kind === 'index') {
      if (time.rateHz !== null) rateHz = time.rateHz;
      else {
        const v = preambleValue(preamble, time.rateKey!);
        rateHz = v === undefined ? NaN : parseRate(v, /interval|interv|period/i.test(time.rateKey!));
        if (!(rateHz > 0)) {
          fail(v === undefined ? `the preamble has no "${time.rateKey}" line` : `the sample rate "${v}" cannot be read`, {
            code: 'time-start-missing',
            expected: `a preamble line "${time.rateKey}: " with a rate such as "20 Hz" or an interval such as "50 ms"`,
          });
          return false;
        }
      }
    }
    if (profile.tag.from === 'preamble') {
      const v = preambleValue(preamble, profile.tag.key);
      if (!v) {
        fail(`the preamble has no "${profile.tag.key}" line with the tag`, { code: 'tag-missing', expected: `a preamble line "${profile.tag.key}: <tag>"` });
        return false;
      }
      fixedTag = v;
    } else if (profile.tag.from === 'file-name') {
      const name = baseName(opts);
      const m = compileTagRegex(profile.tag.pattern).exec(name);
      const tag = m ? firstGroup(m, 'tag') : null;
      if (!tag) {
        fail(`the file name "${name}" holds no tag`, { code: 'tag-missing', expected: `a name matching /${profile.tag.pattern}/` });
        return false;
      }
      fixedTag = tag;
    }
    if (profile.role.from === 'preamble') {
      const v = preambleValue(preamble, profile.role.key);
      const r = v !== undefined ? roleWords.get(normaliseWord(v)) : undefined;
      if (v === undefined) {
        fixedRole = 'trap';
        problems.add(`the preamble has no "${profile.role.key}" line; the tests are taken as trap tests`, { code: 'role-unknown', severity: 'warning', expected: `a preamble line "${profile.role.key}: " with ${roleExpected}` });
      } else if (!r) {
        fail(`the point role "${v}" is not known`, { code: 'role-unknown', expected: roleExpected });
        return false;
      } else fixedRole = r;
    } else if (profile.role.from === 'none') fixedRole = 'trap';
    linker.setPreamble(preamble);
    return true;
  }

  function onRow(row: RowView): boolean {
    counts.lines = row.lastLine;
    if (phase === 'preamble') {
      const raw = row.src.slice(row.rowStart, row.rowEnd);
      if (raw.trim()) nonBlankLines++;
      const isHeader = expectedHeader.length
        ? row.count >= expectedHeader.length && sameHeader(row)
        : row.count >= 2 && !parsePreambleLine(raw, profile.delimiter);
      if (isHeader) {
        if (!onHeaderRead()) return false;
        phase = profile.unitsRow ? 'units' : 'data';
        if (expectedHeader.length) return true;
        // A file without a header row: this row is already data.
      } else {
        const kv = parsePreambleLine(raw, profile.delimiter);
        if (kv) preamble.push({ ...kv, line: row.line });
        if (row.line > MAX_PREAMBLE_LINES) {
          fail(`no header row in the first ${MAX_PREAMBLE_LINES} lines matches the profile "${profile.name}"`, {
            code: 'header-mismatch',
            expected: `the header ${JSON.stringify(profile.header.join(profile.delimiter))}`,
          });
          return false;
        }
        return true;
      }
    } else if (phase === 'units') {
      phase = 'data';
      return true;
    } else if (phase === 'stopped') return false;
    return dataRow(row);
  }

  function sameHeader(row: RowView): boolean {
    let n = row.count;
    while (n > 0 && row.starts[n - 1] === row.ends[n - 1]) n--;
    if (n !== expectedHeader.length) return false;
    for (let i = 0; i < n; i++) if (normaliseWord(fieldText(row, i)) !== expectedHeader[i]) return false;
    return true;
  }

  function dataRow(row: RowView): boolean {
    const src = row.src;
    if (row.count === 1 && row.starts[0] === row.ends[0]) {
      counts.blank++;
      return true;
    }
    counts.dataRows++;
    const line = row.line;
    if (row.count < neededFields) {
      skip(`the row has ${row.count} field${row.count === 1 ? '' : 's'}`, {
        code: 'row-too-few-fields',
        line,
        expected: `at least ${neededFields} fields separated by "${profile.delimiter === '\t' ? 'tab' : profile.delimiter}"`,
        found: src.slice(row.rowStart, row.rowEnd),
      });
      return true;
    }
    if (row.malformedQuote) {
      problems.add('a quoted field has text after its closing quote; the text was kept as written', { code: 'csv-malformed-quote', severity: 'warning', line, expected: 'a delimiter right after a closing quote' });
    }
    if (header.length && row.count > header.length) {
      for (let i = header.length; i < row.count; i++)
        if (row.ends[i] > row.starts[i]) {
          problems.add(`the row has ${row.count} fields, the header ${header.length}; the extra fields were ignored`, { code: 'row-extra-fields', severity: 'warning', line, column: i + 1, expected: `${header.length} fields` , found: fieldText(row, i) });
          break;
        }
    }
    // Time
    let t: number;
    const tc = 'column' in time && time.column !== null ? time.column : -1;
    switch (time.kind) {
      case 'datetime': {
        let w: number;
        if (time.timeColumn === null) w = parseDateTime(src, row.starts[tc], row.ends[tc], time.order, cur);
        else {
          const day = parseDateOnly(src, row.starts[tc], row.ends[tc], time.order, cur);
          const tod = parseTimeOnly(src, row.starts[time.timeColumn], row.ends[time.timeColumn], cur);
          w = day + tod;
        }
        if (Number.isNaN(w)) {
          const c = time.timeColumn !== null && !Number.isNaN(parseDateOnly(src, row.starts[tc], row.ends[tc], time.order, cur)) ? time.timeColumn : tc;
          skip('the time cannot be read', {
            code: 'time-invalid',
            line,
            column: c + 1,
            columnName: colName(c),
            expected: c === tc ? describeDateOrder(time.order) : 'a time of day like 09:14:03 or 09:14:03,5',
            found: fieldText(row, c),
          });
          return true;
        }
        t = Number.isNaN(cur.zoneOffsetMs) ? toUtc(w) : w - cur.zoneOffsetMs;
        if (failed) return false;
        break;
      }
      case 'epoch': {
        const x = parseDecimal(src, row.starts[tc], row.ends[tc], mark);
        if (Number.isNaN(x)) {
          skip('the time cannot be read', { code: 'time-invalid', line, column: tc + 1, columnName: colName(tc), expected: `${time.unit === 's' ? 'seconds' : 'milliseconds'} since 1970`, found: fieldText(row, tc) });
          return true;
        }
        t = time.unit === 's' ? x * 1000 : x;
        break;
      }
      case 'elapsed': {
        const x = parseDecimal(src, row.starts[tc], row.ends[tc], mark);
        if (Number.isNaN(x)) {
          skip('the time cannot be read', { code: 'time-invalid', line, column: tc + 1, columnName: colName(tc), expected: `${time.unit === 's' ? 'seconds' : 'milliseconds'} since the start`, found: fieldText(row, tc) });
          return true;
        }
        t = startMs + (time.unit === 's' ? x * 1000 : x);
        break;
      }
      case 'index': {
        // Without a sample-number column the row order counts; a skipped
        // garbage line is not a reading, so it does not advance the count.
        let k = rowIndex;
        if (tc >= 0) {
          k = parseDecimal(src, row.starts[tc], row.ends[tc], mark);
          if (!Number.isInteger(k)) {
            skip('the sample number cannot be read', { code: 'time-invalid', line, column: tc + 1, columnName: colName(tc), expected: 'a whole sample number', found: fieldText(row, tc) });
            return true;
          }
        }
        t = startMs + (k * 1000) / rateHz;
        break;
      }
    }
    // Level
    const lc = profile.level.column;
    const raw = parseDecimal(src, row.starts[lc], row.ends[lc], mark);
    if (Number.isNaN(raw)) {
      skip('the level cannot be read', { code: 'level-invalid', line, column: lc + 1, columnName: colName(lc), expected: `a number with "${profile.decimalMark}" as decimal mark`, found: fieldText(row, lc) });
      return true;
    }
    const level = toDb(raw);
    if (Number.isNaN(level)) {
      skip('an RMS voltage of zero or less has no level in dB', { code: 'level-not-positive', line, column: lc + 1, columnName: colName(lc), expected: 'a positive RMS voltage', found: fieldText(row, lc) });
      return true;
    }
    // Temperature
    let temp = NaN;
    if (toC && profile.temperature) {
      const pc = profile.temperature.column;
      const x = parseDecimal(src, row.starts[pc], row.ends[pc], mark);
      if (Number.isNaN(x)) {
        if (fieldText(row, pc).trim() !== '') {
          skip('the temperature cannot be read', { code: 'temperature-invalid', line, column: pc + 1, columnName: colName(pc), expected: `a number with "${profile.decimalMark}" as decimal mark, or an empty cell`, found: fieldText(row, pc) });
          return true;
        }
        counts.missingTemperature++;
      } else temp = toC(x);
    }
    // Tag
    let tag: string;
    if (fixedTag !== null) tag = fixedTag;
    else {
      const gc = (profile.tag as { column: number }).column;
      let s = row.starts[gc];
      let e = row.ends[gc];
      while (s < e && src.charCodeAt(s) === 32) s++;
      while (e > s && src.charCodeAt(e - 1) === 32) e--;
      if (builder && e - s === builder.tag.length && src.startsWith(builder.tag, s)) tag = builder.tag;
      else tag = fieldText(row, gc).trim();
      if (!tag) {
        skip('the tag is empty', { code: 'tag-empty', line, column: gc + 1, columnName: colName(gc), expected: 'a trap tag' });
        return true;
      }
    }
    // Role
    let role: PointRole;
    if (fixedRole !== null) role = fixedRole;
    else if (refTagRegex) {
      let r = roleOfTag.get(tag);
      if (!r) {
        r = refTagRegex.test(tag) ? 'reference' : 'trap';
        roleOfTag.set(tag, r);
      }
      role = r;
    } else {
      const rc = (profile.role as { column: number }).column;
      const s = row.starts[rc];
      const e = row.ends[rc];
      if (e - s === lastRoleText.length && src.startsWith(lastRoleText, s)) role = lastRole;
      else {
        const text = fieldText(row, rc);
        const r = roleWords.get(normaliseWord(text));
        if (!r) {
          skip(`the point role "${text.trim()}" is not known`, { code: 'role-unknown', line, column: rc + 1, columnName: colName(rc), expected: roleExpected, found: text });
          return true;
        }
        lastRoleText = src.slice(s, e);
        lastRole = r;
        role = r;
      }
    }
    rowIndex++;
    addReading(tag, role, t, level, temp, line);
    return true;
  }

  function addReading(tag: string, role: PointRole, t: number, level: number, temp: number, line: number): void {
    let b = builder;
    if (b && (b.tag !== tag || b.role !== role)) {
      closeTest();
      b = null;
    }
    if (b && b.n > 0) {
      const dt = t - b.lastTime;
      const period = time.kind === 'index' ? 1000 / rateHz : b.periodMs;
      const gap = Math.max(gapFloorMs, Number.isNaN(period) ? 0 : profile.split.gapPeriods * period);
      if (dt < 0) {
        problems.add(`the time goes back by ${(-dt / 1000).toFixed(3)} s`, {
          code: 'time-backwards',
          severity: 'warning',
          line,
          expected: -dt > gap ? 'times that increase (a jump this large starts a new test)' : 'times that increase (the readings were sorted)',
        });
        if (-dt > gap) {
          closeTest();
          b = null;
        } else b.backwards++;
      } else if (dt > gap) {
        problems.add(`a gap of ${(dt / 1000).toFixed(1)} s in the readings of ${tag} starts a new test`, {
          code: 'test-split-gap',
          severity: 'warning',
          line,
          expected: `gaps of at most ${(gap / 1000).toFixed(1)} s within one test`,
        });
        closeTest();
        b = null;
      }
    }
    if (!b) {
      b = new SeriesBuilder(tag, role, toC !== null);
      builder = b;
    }
    b.add(t, level, temp, line);
    counts.readings++;
  }

  const tokenizer = new CsvTokenizer({
    delimiter: profile.delimiter,
    onRow,
    onProblem: (p) => {
      if (p.code === 'csv-unterminated-quote') fail('a quoted field is never closed; the rest of the file would be one field', { code: p.code, line: p.line, expected: 'a closing double quote' });
      else fail(`a row of ${p.length} characters: this is not a meter export`, { code: p.code, line: p.line, expected: 'rows shorter than a megabyte' });
    },
  });

  function feedText(text: string): void {
    if (failed || !text) return;
    tokenizer.push(text);
  }

  function start(bytes: Uint8Array, isWhole: boolean): void {
    const binary = sniffBinary(bytes, (encoding ?? detectEncoding(bytes, isWhole).encoding).startsWith('utf-16'));
    if (binary) {
      fail(`this is ${binary}, not a meter export`, { code: 'file-not-text', expected: 'delimited text (CSV, semicolon, tab or pipe separated)' });
      return;
    }
    let skipBytes = 0;
    if (encoding === null) {
      const g = detectEncoding(bytes, isWhole);
      encoding = g.encoding;
      skipBytes = g.bomLength;
      if (g.encoding === 'windows-1252') problems.add(`encoding guessed: ${g.reason}`, { code: 'encoding-guessed', severity: 'warning', expected: 'UTF-8 or a byte-order mark' });
    } else {
      const bom = bomOf(bytes);
      if (bom && bom.encoding === encoding) skipBytes = bom.length;
    }
    decoder = createDecoder(encoding, skipBytes);
  }

  function decode(bytes: Uint8Array): void {
    try {
      feedText(decoder!.write(bytes));
    } catch (e) {
      if (!(e instanceof EncodingError)) throw e;
      fail(`${e.message}; the file cannot be read as ${encoding}`, { code: 'encoding-invalid', line: counts.lines + 1, expected: `${encoding} text throughout, or set the profile's encoding` });
    }
  }

  return {
    push(bytes: Uint8Array) {
      if (failed || bytes.length === 0) return;
      totalBytes += bytes.length;
      if (head) {
        // Hold the start until there is enough to detect the encoding and sniff for binary.
        const joined = new Uint8Array(head.length + bytes.length);
        joined.set(head);
        joined.set(bytes, head.length);
        if (joined.length < ENCODING_SAMPLE_BYTES) {
          head = joined;
          return;
        }
        head = null;
        start(joined, false);
        if (!failed) decode(joined);
        return;
      }
      decode(bytes);
    },
    end(): ReadResult {
      if (head) {
        const bytes = head;
        head = null;
        if (bytes.length === 0) fail('the file is empty (0 bytes)', { code: 'file-empty', expected: 'a header row and data rows' });
        else {
          start(bytes, true);
          if (!failed) decode(bytes);
        }
      }
      if (!failed && decoder) {
        try {
          feedText(decoder.end());
        } catch (e) {
          if (!(e instanceof EncodingError)) throw e;
          fail(e.message, { code: 'encoding-invalid', line: counts.lines, expected: `${encoding} text throughout` });
        }
        tokenizer.end();
      }
      if (!failed) {
        if (phase === 'preamble') {
          if (nonBlankLines === 0) fail(totalBytes === 0 ? 'the file is empty (0 bytes)' : 'the file holds only blank lines', { code: 'file-empty', expected: 'a header row and data rows' });
          else if (expectedHeader.length)
            fail(`no header row matches the profile "${profile.name}"`, { code: 'header-mismatch', expected: `the header ${JSON.stringify(profile.header.join(profile.delimiter))}` });
          else fail('the file has no data rows', { code: 'file-header-only', expected: 'data rows' });
        } else if (counts.dataRows === 0) fail('the file has a header row but no data rows', { code: 'file-header-only', line: counts.lines, expected: 'data rows after the header' });
        else if (counts.readings === 0) fail(`none of the ${counts.dataRows} data rows could be read (see the skipped rows)`, { code: 'file-no-readings', expected: 'at least one readable row' });
      }
      if (!failed) closeTest();
      const list = problems.finish();
      const refused = list.some((p) => p.severity === 'error');
      return { tests: refused ? [] : tests, problems: list, rowCounts: counts, preamble, encoding };
    },
  };
}

/** Reads a whole file held in memory. */
export function readTests(bytes: Uint8Array, profile: InstrumentProfile, opts: ReadOptions): ReadResult {
  const r = createTestReader(profile, opts);
  // Fed in slices so that a large buffer is decoded and tokenized piecewise.
  const step = 1 << 20;
  for (let i = 0; i < bytes.length; i += step) r.push(bytes.subarray(i, Math.min(bytes.length, i + step)));
  return r.end();
}

/** Reads a file from a stream of chunks (a file stream, an inflating zip entry). */
export async function readTestsFromStream(chunks: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, profile: InstrumentProfile, opts: ReadOptions): Promise<ReadResult> {
  const r = createTestReader(profile, opts);
  for await (const c of chunks) r.push(c);
  return r.end();
}

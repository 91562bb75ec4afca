import iconv from 'iconv-lite';
import { Readable } from 'node:stream';
import { crc32, createInflateRaw, inflateRawSync } from 'node:zlib';
import type { ImportProblem } from './problems';

/**
 * Zip reading with limits (BRIEF §7), pure over bytes in memory.
 *
 * Why our own directory reader instead of jszip: the limits must be counted
 * while each entry inflates, whatever sizes the headers claim. Node's zlib
 * stops at `maxOutputLength` (or when our stream counter trips), so a small
 * zip that expands to gigabytes is refused after at most the limit, not after
 * memory runs out. Entry names are labels only: nothing here touches a disk.
 */

export interface ZipLimits {
  /** Most entries (files and folders) in one zip. */
  maxEntries: number;
  /** Most bytes inflated from one zip, all entries together. */
  maxTotalInflatedBytes: number;
  /** An entry inflating to more than this many times its compressed size is refused. */
  maxEntryRatio: number;
  /**
   * Entries inflating to no more than this are exempt from the ratio rule: a
   * few hundred bytes of a repetitive file can exceed 200× honestly, and that
   * small an output is harmless.
   */
  ratioFloorBytes: number;
}

export const DEFAULT_ZIP_LIMITS: ZipLimits = {
  maxEntries: 10_000,
  maxTotalInflatedBytes: 2 * 1024 ** 3,
  maxEntryRatio: 200,
  ratioFloorBytes: 64 * 1024,
};

/** File endings read as meter exports; everything else is listed as skipped. */
export const DATA_EXTENSIONS = ['.csv', '.txt', '.tsv', '.tab', '.dat', '.log'];

export interface ZipEntry {
  /** The entry's path inside the zip, `/`-separated; a label, never a path on disk. */
  name: string;
  /** The last path segment. */
  baseName: string;
  /** Folder names from the root down (an area, a date…). */
  hints: string[];
  /** A date read from a folder name (YYYY-MM-DD), or null. */
  dateHint: string | null;
  /** The innermost folder that is not a date, or null. */
  areaHint: string | null;
  compressedSize: number;
  /** What the header claims; not trusted for limits. */
  declaredSize: number;
  /** Inflates the whole entry within the limits. */
  read(): ZipReadResult;
  /** Inflates the entry as a stream of chunks within the limits (for large entries). */
  chunks(): AsyncGenerator<Uint8Array, void, undefined>;
}

export type ZipReadResult = { ok: true; bytes: Uint8Array } | { ok: false; problem: ImportProblem };

export interface SkippedEntry {
  name: string;
  reason: string;
}

export interface ZipContents {
  entries: ZipEntry[];
  skipped: SkippedEntry[];
  problems: ImportProblem[];
}

export class ZipLimitError extends Error {
  constructor(readonly problem: ImportProblem) {
    super(problem.message);
  }
}

interface CentralEntry {
  name: string;
  flags: number;
  method: number;
  crc: number;
  compressedSize: number;
  declaredSize: number;
  localOffset: number;
}

const SIG_EOCD = 0x06054b50;
const SIG_EOCD64 = 0x06064b50;
const SIG_EOCD64_LOCATOR = 0x07064b50;
const SIG_CENTRAL = 0x02014b50;
const SIG_LOCAL = 0x04034b50;

function u16(b: Uint8Array, o: number): number {
  return b[o] | (b[o + 1] << 8);
}
function u32(b: Uint8Array, o: number): number {
  return (b[o] | (b[o + 1] << 8) | (b[o + 2] << 16)) + b[o + 3] * 0x1000000;
}
function u64(b: Uint8Array, o: number): number {
  return u32(b, o) + u32(b, o + 4) * 0x100000000;
}

function findEocd(b: Uint8Array): number {
  const stop = Math.max(0, b.length - 22 - 0xffff);
  for (let i = b.length - 22; i >= stop; i--) if (u32(b, i) === SIG_EOCD) return i;
  return -1;
}

/** Why an entry name is refused as unsafe, or null when it is a plain relative name. */
export function unsafeNameReason(name: string): string | null {
  if (name.includes('\0')) return 'the name holds a zero byte';
  const n = name.replace(/\\/g, '/');
  if (n.startsWith('/')) return 'an absolute path';
  if (/^[A-Za-z]:/.test(n)) return 'a path with a drive letter';
  if (n.split('/').some((s) => s === '..')) return 'a path that climbs out of the zip ("..")';
  return null;
}

function junkReason(name: string): string | null {
  const parts = name.split('/');
  const base = parts[parts.length - 1];
  if (name.endsWith('/')) return 'a folder';
  if (parts.includes('__MACOSX')) return 'macOS resource data (__MACOSX)';
  if (base === '.DS_Store') return 'macOS folder settings (.DS_Store)';
  if (base.startsWith('._')) return 'macOS resource data (._ file)';
  if (base === 'Thumbs.db' || base === 'desktop.ini') return 'Windows folder data';
  const dot = base.lastIndexOf('.');
  const ext = dot > 0 ? base.slice(dot).toLowerCase() : '';
  if (ext === '.zip') return 'a zip inside the zip (not opened; upload it on its own)';
  if (!DATA_EXTENSIONS.includes(ext)) return `not a data file (${ext || 'no file ending'})`;
  return null;
}

const DATE_FOLDER = [
  { re: /^(\d{4})-(\d{2})-(\d{2})$/, ymd: [1, 2, 3] },
  { re: /^(\d{4})(\d{2})(\d{2})$/, ymd: [1, 2, 3] },
  { re: /^(\d{2})\.(\d{2})\.(\d{4})$/, ymd: [3, 2, 1] },
];

function dateOfFolder(folder: string): string | null {
  for (const { re, ymd } of DATE_FOLDER) {
    const m = re.exec(folder.trim());
    if (!m) continue;
    const [y, mo, d] = ymd.map((i) => Number(m[i]));
    if (mo >= 1 && mo <= 12 && d >= 1 && d <= 31) return `${y}-${String(mo).padStart(2, '0')}-${String(d).padStart(2, '0')}`;
  }
  return null;
}

export function readZip(bytes: Uint8Array, limits: Partial<ZipLimits> = {}, fileName = 'upload.zip'): ZipContents {
  const lim: ZipLimits = { ...DEFAULT_ZIP_LIMITS, ...limits };
  const problems: ImportProblem[] = [];
  const skipped: SkippedEntry[] = [];
  const entries: ZipEntry[] = [];
  const problem = (p: Omit<ImportProblem, 'file' | 'message'> & { summary: string }): ImportProblem => {
    const { summary, ...rest } = p;
    const at = rest.entry ? `${fileName} › ${rest.entry}` : fileName;
    let message = `${at}: ${summary}`;
    if (rest.expected) message += `; expected ${rest.expected}`;
    return { ...rest, file: fileName, message };
  };
  const out = () => ({ entries, skipped, problems });

  if (bytes.length === 0) {
    problems.push(problem({ code: 'zip-empty', severity: 'error', summary: 'the zip is empty (0 bytes)', expected: 'a zip archive' }));
    return out();
  }
  const startsLikeZip = bytes.length >= 4 && u32(bytes, 0) === SIG_LOCAL;
  const eocd = findEocd(bytes);
  if (eocd < 0) {
    problems.push(
      startsLikeZip
        ? problem({ code: 'zip-truncated', severity: 'error', summary: 'the zip ends early: its table of contents at the end is missing (an interrupted copy or upload?)', expected: 'a complete zip archive' })
        : problem({ code: 'zip-not-zip', severity: 'error', summary: 'this is not a zip archive', expected: 'a zip archive' }),
    );
    return out();
  }
  let count = u16(bytes, eocd + 10);
  let cdSize = u32(bytes, eocd + 12);
  let cdOffset = u32(bytes, eocd + 16);
  if (count === 0xffff || cdSize === 0xffffffff || cdOffset === 0xffffffff) {
    const loc = eocd - 20;
    if (loc >= 0 && u32(bytes, loc) === SIG_EOCD64_LOCATOR) {
      const rec = u64(bytes, loc + 8);
      if (rec + 56 <= bytes.length && u32(bytes, rec) === SIG_EOCD64) {
        count = u64(bytes, rec + 32);
        cdSize = u64(bytes, rec + 40);
        cdOffset = u64(bytes, rec + 48);
      }
    }
  }
  if (count > lim.maxEntries) {
    problems.push(problem({ code: 'zip-too-many-entries', severity: 'error', summary: `the zip holds ${count} entries, more than the limit of ${lim.maxEntries}`, expected: `at most ${lim.maxEntries} entries` }));
    return out();
  }
  if (cdOffset + cdSize > bytes.length) {
    problems.push(problem({ code: 'zip-truncated', severity: 'error', summary: 'the zip ends early: its table of contents points past the end of the file', expected: 'a complete zip archive' }));
    return out();
  }

  const central: CentralEntry[] = [];
  let p = cdOffset;
  for (let i = 0; i < count; i++) {
    if (p + 46 > bytes.length || u32(bytes, p) !== SIG_CENTRAL) {
      problems.push(problem({ code: 'zip-truncated', severity: 'error', summary: `the table of contents is damaged at entry ${i + 1} of ${count}`, expected: 'a complete zip archive' }));
      return out();
    }
    const flags = u16(bytes, p + 8);
    const nameLen = u16(bytes, p + 28);
    const extraLen = u16(bytes, p + 30);
    const commentLen = u16(bytes, p + 32);
    const rawName = bytes.subarray(p + 46, p + 46 + nameLen);
    // Bit 11 marks UTF-8 names; older tools write the DOS code page 437.
    const name = flags & 0x800 ? new TextDecoder().decode(rawName) : iconv.decode(Buffer.from(rawName), 'cp437');
    let compressedSize = u32(bytes, p + 20);
    let declaredSize = u32(bytes, p + 24);
    let localOffset = u32(bytes, p + 42);
    // ZIP64 sizes live in extra field 0x0001, in this order, only for the fields that overflowed.
    let e = p + 46 + nameLen;
    const eEnd = e + extraLen;
    while (e + 4 <= eEnd) {
      const id = u16(bytes, e);
      const len = u16(bytes, e + 2);
      if (id === 0x0001) {
        let q = e + 4;
        if (declaredSize === 0xffffffff) { declaredSize = u64(bytes, q); q += 8; }
        if (compressedSize === 0xffffffff) { compressedSize = u64(bytes, q); q += 8; }
        if (localOffset === 0xffffffff) localOffset = u64(bytes, q);
      }
      e += 4 + len;
    }
    central.push({ name, flags, method: u16(bytes, p + 10), crc: u32(bytes, p + 16), compressedSize, declaredSize, localOffset });
    p += 46 + nameLen + extraLen + commentLen;
  }

  let inflatedSoFar = 0;
  for (const c of central) {
    const unsafe = unsafeNameReason(c.name);
    if (unsafe) {
      problems.push(problem({ code: 'zip-entry-unsafe-name', severity: 'error', entry: c.name, summary: `entry refused: ${unsafe}`, expected: 'a relative name inside the zip' }));
      continue;
    }
    const name = c.name.replace(/\\/g, '/').replace(/^\.\/+/, '');
    const junk = junkReason(name);
    if (junk) {
      skipped.push({ name, reason: junk });
      continue;
    }
    if (c.flags & 0x1) {
      problems.push(problem({ code: 'zip-entry-encrypted', severity: 'error', entry: name, summary: 'the entry is password-protected', expected: 'an entry without a password' }));
      continue;
    }
    if (c.method !== 0 && c.method !== 8) {
      problems.push(problem({ code: 'zip-entry-unsupported', severity: 'error', entry: name, summary: `the entry is compressed with method ${c.method}`, expected: 'stored or deflated entries (the usual zip methods)' }));
      continue;
    }
    const lh = c.localOffset;
    if (lh + 30 > bytes.length || u32(bytes, lh) !== SIG_LOCAL) {
      problems.push(problem({ code: 'zip-truncated', severity: 'error', entry: name, summary: 'the entry\'s data is missing (the zip is cut short or damaged)', expected: 'a complete zip archive' }));
      continue;
    }
    const dataStart = lh + 30 + u16(bytes, lh + 26) + u16(bytes, lh + 28);
    if (dataStart + c.compressedSize > bytes.length) {
      problems.push(problem({ code: 'zip-truncated', severity: 'error', entry: name, summary: 'the entry\'s data runs past the end of the zip (the zip is cut short)', expected: 'a complete zip archive' }));
      continue;
    }
    const data = bytes.subarray(dataStart, dataStart + c.compressedSize);
    const parts = name.split('/');
    const folders = parts.slice(0, -1).filter(Boolean);
    const dateHint = [...folders].reverse().map(dateOfFolder).find((d) => d !== null) ?? null;
    const areaHint = [...folders].reverse().find((f) => dateOfFolder(f) === null) ?? null;

    const entryLimit = () => {
      const remaining = lim.maxTotalInflatedBytes - inflatedSoFar;
      const byRatio = Math.max(lim.maxEntryRatio * c.compressedSize, lim.ratioFloorBytes);
      return { max: Math.min(remaining, byRatio), ratioBinds: byRatio <= remaining };
    };
    const overLimit = (ratioBinds: boolean, atLeast: number): ImportProblem =>
      ratioBinds
        ? problem({
            code: 'zip-entry-ratio',
            severity: 'error',
            entry: name,
            summary: `the entry inflates to more than ${lim.maxEntryRatio}× its compressed size of ${c.compressedSize} bytes (stopped after ${atLeast} bytes; its header claimed ${c.declaredSize}): refused as a possible zip bomb`,
            expected: `at most ${lim.maxEntryRatio}× the compressed size`,
          })
        : problem({
            code: 'zip-total-too-large',
            severity: 'error',
            entry: name,
            summary: `the zip inflates to more than ${lim.maxTotalInflatedBytes} bytes in all (stopped in this entry)`,
            expected: `at most ${lim.maxTotalInflatedBytes} bytes inflated per zip`,
          });
    const corrupt = (why: string): ImportProblem => problem({ code: 'zip-entry-corrupt', severity: 'error', entry: name, summary: `the entry is damaged: ${why}`, expected: 'an intact zip entry' });
    const check = (out: Uint8Array): ImportProblem | null => {
      if (crc32(out) >>> 0 !== c.crc) return corrupt('its checksum does not match');
      if (out.length !== c.declaredSize) return corrupt(`it inflates to ${out.length} bytes, its header says ${c.declaredSize}`);
      return null;
    };

    entries.push({
      name,
      baseName: parts[parts.length - 1],
      hints: folders,
      dateHint,
      areaHint,
      compressedSize: c.compressedSize,
      declaredSize: c.declaredSize,
      read(): ZipReadResult {
        const { max, ratioBinds } = entryLimit();
        let out: Uint8Array;
        if (c.method === 0) {
          if (data.length > max) return { ok: false, problem: overLimit(false, data.length) };
          out = data;
        } else {
          try {
            // maxOutputLength makes zlib stop as soon as the output passes the limit.
            out = inflateRawSync(data, { maxOutputLength: Math.max(1, max + 1) });
          } catch (e) {
            const code = (e as NodeJS.ErrnoException).code;
            if (code === 'ERR_BUFFER_TOO_LARGE' || e instanceof RangeError) return { ok: false, problem: overLimit(ratioBinds, max) };
            return { ok: false, problem: corrupt((e as Error).message) };
          }
          if (out.length > max) return { ok: false, problem: overLimit(ratioBinds, out.length) };
        }
        inflatedSoFar += out.length;
        const bad = check(out);
        return bad ? { ok: false, problem: bad } : { ok: true, bytes: out };
      },
      async *chunks() {
        if (c.method === 0) {
          const { max } = entryLimit();
          if (data.length > max) throw new ZipLimitError(overLimit(false, data.length));
          inflatedSoFar += data.length;
          const bad = check(data);
          if (bad) throw new ZipLimitError(bad);
          for (let i = 0; i < data.length; i += 1 << 16) yield data.subarray(i, Math.min(data.length, i + (1 << 16)));
          return;
        }
        const { max, ratioBinds } = entryLimit();
        const inflate = createInflateRaw();
        const input = Readable.from((function* () {
          for (let i = 0; i < data.length; i += 1 << 16) yield Buffer.from(data.buffer, data.byteOffset + i, Math.min(1 << 16, data.length - i));
        })());
        input.pipe(inflate);
        let n = 0;
        let crc = 0;
        try {
          for await (const chunk of inflate as AsyncIterable<Buffer>) {
            n += chunk.length;
            if (n > max) throw new ZipLimitError(overLimit(ratioBinds, n));
            inflatedSoFar += chunk.length;
            crc = crc32(chunk, crc);
            yield new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.length);
          }
        } catch (e) {
          if (e instanceof ZipLimitError) throw e;
          throw new ZipLimitError(corrupt((e as Error).message));
        } finally {
          input.unpipe(inflate);
          input.destroy();
          inflate.destroy();
        }
        if (crc >>> 0 !== c.crc) throw new ZipLimitError(corrupt('its checksum does not match'));
        if (n !== c.declaredSize) throw new ZipLimitError(corrupt(`it inflates to ${n} bytes, its header says ${c.declaredSize}`));
      },
    });
  }
  return out();
}

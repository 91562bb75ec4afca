/**
 * Import micro-benchmark (issue 3, "Speed"): a script, not a timed test.
 *
 *   npx tsx scripts/bench-import.ts            # day of files + one 100 MB file
 *   npx tsx scripts/bench-import.ts --small    # a tenth of the size, for a quick look
 *
 * Prints, for the same bytes: papaparse alone in streaming chunk mode (rows
 * parsed, nothing converted), then Plumeward's detect + read + normalise, their
 * ratio, samples per second and peak RSS. The 100 MB file is written to a temp
 * folder and streamed from disk, so its memory is the reader's, not the file's.
 * Storage and analysis are not wired in here (they live outside lib/import).
 */
import { createReadStream, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { detectLayout } from '../lib/import/detect-layout';
import { createTestReader, readTests } from '../lib/import/read-tests';

const small = process.argv.includes('--small');
const FILES = small ? 50 : 500;
const SAMPLES = small ? 200_000 : 2_000_000;
const BIG_BYTES = small ? 10e6 : 100e6;

let peakRss = 0;
const sampler = setInterval(() => {
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
}, 20);
const mb = (n: number) => `${(n / 1e6).toFixed(1)} MB`;

/** Model A layout: one comma-separated test per file, ISO UTC times. */
function modelAFile(tag: string, start: number, n: number, seed: number): string {
  const parts: string[] = ['utc_time,trap_tag,ultrasound_db,surface_temp_c\n'];
  let x = seed;
  for (let i = 0; i < n; i++) {
    x = (x * 1103515245 + 12345) % 2147483648;
    const db = 18 + (x % 500) / 10;
    const c = 150 + (x % 70) / 10;
    parts.push(`${new Date(start + i * 100).toISOString()},${tag},${db.toFixed(1)},${c.toFixed(1)}\n`);
  }
  return parts.join('');
}

function papaParse(text: string): number {
  let rows = 0;
  // String input in chunk mode runs synchronously; `complete` is still required by the types.
  Papa.parse<string[]>(text, {
    chunkSize: 1 << 20,
    chunk: (r: Papa.ParseResult<string[]>) => {
      rows += r.data.length;
    },
    complete: () => {},
  });
  return rows;
}

function papaParseStream(path: string): Promise<number> {
  return new Promise((resolve, reject) => {
    let rows = 0;
    Papa.parse<string[]>(createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 20 }) as unknown as File, {
      chunk: (r) => {
        rows += r.data.length;
      },
      complete: () => resolve(rows),
      error: reject,
    });
  });
}

async function bigFile(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'plumeward-bench-'));
  const path = join(dir, 'big.csv');
  try {
    // One long file of many tests (a tag change every 3,000 readings).
    const chunks: string[] = [];
    let size = 0;
    let k = 0;
    while (size < BIG_BYTES) {
      const s = modelAFile(`FV-EVP-${String(k % 1000).padStart(3, '0')}`, Date.UTC(2025, 3, 8) + k * 400_000, 3000, k).replace(/^[^\n]*\n/, k === 0 ? '$&' : '');
      chunks.push(s);
      size += s.length;
      k++;
    }
    writeFileSync(path, chunks.join(''));
    chunks.length = 0;
    const bytes = statSync(path).size;
    global.gc?.();
    let t0 = performance.now();
    const papaRows = await papaParseStream(path);
    const papaS = (performance.now() - t0) / 1000;

    peakRss = process.memoryUsage().rss;
    t0 = performance.now();
    const head = await new Promise<Buffer>((resolve) => {
      const s = createReadStream(path, { start: 0, end: 256 * 1024 - 1 });
      const parts: Buffer[] = [];
      s.on('data', (d) => parts.push(d as Buffer)).on('end', () => resolve(Buffer.concat(parts)));
    });
    const layout = detectLayout(new Uint8Array(head), { fileName: 'big.csv', isWholeFile: false });
    let samples = 0;
    let tests = 0;
    const reader = createTestReader(layout.suggestedProfile!, {
      fileName: 'big.csv',
      onTest: (t) => {
        samples += t.sampleCount;
        tests++;
      },
    });
    for await (const c of createReadStream(path, { highWaterMark: 1 << 20 })) reader.push(c as Buffer);
    const result = reader.end();
    const ourS = (performance.now() - t0) / 1000;
    const errors = result.problems.filter((p) => p.severity === 'error');
    console.log(`single file: ${mb(bytes)}, ${papaRows} papaparse rows, ${tests} tests, ${samples} samples${errors.length ? `, ERRORS: ${errors[0].message}` : ''}`);
    console.log(`  papaparse streaming chunks: ${papaS.toFixed(2)} s (${mb(bytes / papaS)}/s)`);
    console.log(`  Plumeward detect + read:    ${ourS.toFixed(2)} s (${mb(bytes / ourS)}/s, ${(samples / ourS / 1e6).toFixed(2)} M samples/s)`);
    console.log(`  ratio: ${(ourS / papaS).toFixed(2)} (target ≤ 2)    peak RSS while reading: ${mb(peakRss)} (target < 400 MB)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function dayOfFiles(): void {
  const per = Math.floor(SAMPLES / FILES);
  const files = Array.from({ length: FILES }, (_, i) => {
    const tag = `FV-EVP-${String(i).padStart(3, '0')}`;
    return { name: `A_${tag}.csv`, text: modelAFile(tag, Date.UTC(2025, 3, 8, 8) + i * 60_000, per, i) };
  });
  const encoded = files.map((f) => ({ name: f.name, bytes: new TextEncoder().encode(f.text) }));
  const total = encoded.reduce((s, f) => s + f.bytes.length, 0);

  let t0 = performance.now();
  let papaRows = 0;
  // papaparse gets text: decoding the bytes is part of its cost, as it is of ours.
  const decoder = new TextDecoder();
  for (const f of encoded) papaRows += papaParse(decoder.decode(f.bytes));
  const papaS = (performance.now() - t0) / 1000;

  peakRss = process.memoryUsage().rss;
  t0 = performance.now();
  let samples = 0;
  let tests = 0;
  for (const f of encoded) {
    const layout = detectLayout(f.bytes, { fileName: f.name });
    const r = readTests(f.bytes, layout.suggestedProfile!, { fileName: f.name });
    for (const t of r.tests) samples += t.sampleCount;
    tests += r.tests.length;
  }
  const ourS = (performance.now() - t0) / 1000;
  console.log(`day of files: ${FILES} files, ${mb(total)}, ${papaRows} papaparse rows, ${tests} tests, ${samples} samples`);
  console.log(`  papaparse streaming chunks: ${papaS.toFixed(2)} s`);
  console.log(`  Plumeward detect + read:    ${ourS.toFixed(2)} s (${(samples / ourS / 1e6).toFixed(2)} M samples/s)`);
  console.log(`  ratio: ${(ourS / papaS).toFixed(2)} (target ≤ 2)    peak RSS: ${mb(peakRss)}`);
}

bigFile()
  .then(dayOfFiles)
  .finally(() => clearInterval(sampler));

/**
 * Import benchmark (issue 3 "Speed", issue 7 "Benchmarks"): a script that prints figures, not a timed test.
 *
 *   npm run bench:import             # a day of files (500 files, 2 M samples) + one ~100 MB file
 *   npm run bench:import -- --small  # a tenth of the size, for a quick look
 *
 * For the same bytes: papaparse alone in streaming chunk mode (rows parsed, nothing converted)
 * against Plumeward's whole import. For the day of files, the import is the server's own
 * processUpload into a throwaway SQLite database (detect, parse, normalise, analyse, store a
 * packed series per test, settle the reference checks); the in-memory pipeline without storage
 * is printed beside it. The 100 MB file is streamed from disk through the pipeline in a child
 * process, so its peak RSS is the reader's own (target < 400 MB).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Papa from 'papaparse';
import { analyseFile } from '../lib/pipeline/analyse-file';
import { registerFromTraps } from '../lib/pipeline/trap-register';
import { isMain, report, runWorker, throwawayData, type Figure } from './bench/common';
import { benchTrap, dayOfFiles, modelAProfile, writeBigFile } from './bench/meter-text';

const BENCH = 'import';

export interface ImportOptions {
  small?: boolean;
}

/**
 * Each figure is the best of RUNS rounds, and a round runs papaparse, the pipeline in memory and
 * the stored import one after the other: on a shared machine a single run measures the
 * neighbours as much as the code, and interleaving lets each side meet the same neighbours.
 */
const RUNS = 3;

function timed(work: () => void): number {
  const t0 = performance.now();
  work();
  return (performance.now() - t0) / 1000;
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

type Stored = { seconds: number; cpuSeconds: number; status: string; tests: number; series: number; samples: number; error: string | null };

/** processUpload of the day into a throwaway SQLite database, in a process of its own. */
function storedRun(files: number, samples: number): Stored {
  const data = throwawayData('import');
  try {
    return runWorker<Stored>('import-store-worker.ts', [String(files), String(samples)], data.env);
  } finally {
    data.remove();
  }
}

/** The day of files: papaparse alone, the pipeline in memory, and processUpload into SQLite. */
function dayFigures(small: boolean) {
  const files = small ? 50 : 500;
  const samples = small ? 200_000 : 2_000_000;
  const day = dayOfFiles(files, samples);
  const bytes = day.reduce((s, f) => s + f.bytes.length, 0);
  const decoder = new TextDecoder();
  const profile = modelAProfile();
  const register = registerFromTraps(day.map((f) => benchTrap(f.tag)), 'bench register');
  let papaRows = 0;
  let pipeSamples = 0;
  let tests = 0;
  let papaS = Infinity;
  let pipelineS = Infinity;
  let stored: Stored | null = null;
  for (let k = 0; k < RUNS; k++) {
    // papaparse gets text: decoding the bytes is part of its cost, as it is of ours.
    papaS = Math.min(papaS, timed(() => {
      papaRows = 0;
      for (const f of day) papaRows += papaParse(decoder.decode(f.bytes));
    }));
    pipelineS = Math.min(pipelineS, timed(() => {
      pipeSamples = 0;
      tests = 0;
      for (const f of day) {
        const r = analyseFile(f.bytes, { fileName: f.name, profile, timeZone: 'UTC', register });
        for (const t of r.tests) pipeSamples += t.sampleCount;
        tests += r.tests.length;
      }
    }));
    const run = storedRun(files, samples);
    if (!stored || run.seconds < stored.seconds) stored = run;
  }
  return { files, samples, bytes, papaRows, papaS, pipelineS, pipeSamples, tests, stored: stored! };
}

export async function runImport(opts: ImportOptions = {}): Promise<Figure[]> {
  const small = !!opts.small;
  const figures: Figure[] = [];
  const add = (name: string, value: number, unit: string, extra: Partial<Figure> = {}) => figures.push({ bench: BENCH, name, value, unit, lowerIsBetter: true, ...extra });

  // ---- a day of files
  const d = dayFigures(small);
  const { stored } = d;
  console.log(`day of files: ${d.files} files, ${(d.bytes / 1e6).toFixed(1)} MB, ${d.papaRows} papaparse rows, ${d.tests} tests, ${d.pipeSamples} samples`);
  console.log(`  (each the best of ${RUNS} interleaved rounds)`);
  console.log(`  papaparse streaming chunks:                 ${d.papaS.toFixed(2)} s`);
  console.log(`  pipeline in memory (detect…analyse):        ${d.pipelineS.toFixed(2)} s`);
  console.log(`  processUpload into SQLite (…store, settle): ${stored.seconds.toFixed(2)} s (${stored.cpuSeconds.toFixed(2)} s of CPU) — upload ${stored.status}, ${stored.tests} tests, ${stored.series} series, ${stored.samples} samples${stored.error ? `, ${stored.error}` : ''}`);
  add('day: papaparse alone', d.papaS, 's');
  add('day: pipeline in memory', d.pipelineS, 's');
  add('day: processUpload (stored)', stored.seconds, 's');
  add('day: ratio stored ÷ papaparse', stored.seconds / d.papaS, '×', { target: { op: '<=', value: 2 } });
  add('day: samples/s stored', stored.samples / stored.seconds / 1e6, 'M/s', { lowerIsBetter: false });

  // ---- one ~100 MB file, streamed from disk
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'plumeward-bench-'));
  try {
    const file = path.join(dir, 'big.csv');
    const big = writeBigFile(file, small ? 10e6 : 100e6);
    const papa = runWorker<{ rows: number; seconds: number; peakRss: number }>('import-big-worker.ts', [file, 'papa'], {});
    const pipe = runWorker<{ tests: number; samples: number; errors: number; seconds: number; peakRss: number }>('import-big-worker.ts', [file, 'pipeline'], {});
    console.log(`single file: ${(big.bytes / 1e6).toFixed(1)} MB, ${papa.rows} papaparse rows, ${pipe.tests} tests, ${pipe.samples} samples${pipe.errors ? `, ${pipe.errors} ERRORS` : ''}`);
    console.log(`  papaparse streaming chunks: ${papa.seconds.toFixed(2)} s, peak RSS ${(papa.peakRss / 1e6).toFixed(0)} MB`);
    console.log(`  pipeline streamed:          ${pipe.seconds.toFixed(2)} s, peak RSS ${(pipe.peakRss / 1e6).toFixed(0)} MB`);
    add('100 MB: papaparse alone', papa.seconds, 's');
    add('100 MB: pipeline streamed', pipe.seconds, 's');
    add('100 MB: ratio pipeline ÷ papaparse', pipe.seconds / papa.seconds, '×', { target: { op: '<=', value: 2 } });
    add('100 MB: samples/s', pipe.samples / pipe.seconds / 1e6, 'M/s', { lowerIsBetter: false });
    add('100 MB: peak RSS', pipe.peakRss / 1e6, 'MB', { target: { op: '<', value: 400 } });
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
  return figures;
}

if (isMain(module)) {
  runImport({ small: process.argv.includes('--small') })
    .then((f) => report(f, 'Import benchmark'))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}

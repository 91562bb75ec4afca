/**
 * Analysis benchmark (issue 7 "Benchmarks"): ns per sample of the whole per-test analysis
 * (lib/pipeline/analysed-test.ts measureTest: level statistics, smoothing, intervals, cycles,
 * temperature against saturation, verdict, loss) over the day of files' 2 M samples, and its share
 * of the import time measured in the same run (the in-memory pipeline over the same bytes:
 * detect, read, normalise, analyse), each the best of three interleaved rounds. Target: share ≤ 10 %.
 *
 *   npm run bench:analysis [-- --small]
 */
import type { NormalisedTest } from '../lib/import/normalised-test';
import { readTests } from '../lib/import/read-tests';
import { analyseFile } from '../lib/pipeline/analyse-file';
import { measureTest } from '../lib/pipeline/analysed-test';
import { registerFromTraps } from '../lib/pipeline/trap-register';
import { isMain, report, type Figure } from './bench/common';
import { benchTrap, dayOfFiles, modelAProfile } from './bench/meter-text';

const BENCH = 'analysis';

export async function runAnalysis(opts: { small?: boolean } = {}): Promise<Figure[]> {
  const files = opts.small ? 50 : 500;
  const samples = opts.small ? 200_000 : 2_000_000;
  const day = dayOfFiles(files, samples);
  const profile = modelAProfile();
  const register = registerFromTraps(day.map((f) => benchTrap(f.tag)), 'bench register');
  const used = { name: 'Model A', source: 'given' as const, layout: 'bench', referenceLink: profile.referenceLink };

  // The same tests read once, for timing the analysis alone.
  const tests: NormalisedTest[] = [];
  for (const f of day) tests.push(...readTests(f.bytes, profile, { fileName: f.name, timeZone: 'UTC' }).tests);
  const n = tests.reduce((s, t) => s + t.sampleCount, 0);
  // Best of three rounds for each, interleaved (as bench:import does), so a stray pause or a busy
  // neighbour does not count, and both sides are measured warm.
  let importS = Infinity;
  let best = Infinity;
  let analysed = 0;
  for (let round = 0; round < 3; round++) {
    // The import in memory, as bench:import measures it.
    let t0 = performance.now();
    for (const f of day) analyseFile(f.bytes, { fileName: f.name, profile, timeZone: 'UTC', register });
    importS = Math.min(importS, (performance.now() - t0) / 1000);
    t0 = performance.now();
    analysed = 0;
    for (const t of tests) if (measureTest(t, { register, profile: used }).analysed.analysis) analysed++;
    best = Math.min(best, (performance.now() - t0) / 1000);
  }
  console.log(`analysis: ${tests.length} tests (${analysed} analysed), ${n} samples: ${(best * 1000).toFixed(0)} ms; import of the same bytes ${importS.toFixed(2)} s`);
  return [
    { bench: BENCH, name: 'whole per-test analysis', value: (best * 1e9) / n, unit: 'ns/sample', lowerIsBetter: true },
    { bench: BENCH, name: `analysis of ${(n / 1e6).toFixed(1)} M samples`, value: best * 1000, unit: 'ms', lowerIsBetter: true },
    { bench: BENCH, name: 'share of import time', value: (100 * best) / importS, unit: '%', target: { op: '<=', value: 10 }, lowerIsBetter: true },
  ];
}

if (isMain(module)) {
  runAnalysis({ small: process.argv.includes('--small') })
    .then((f) => report(f, 'Analysis benchmark'))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}

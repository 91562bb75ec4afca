// Child process of bench:import for the single ~100 MB file, so that its peak RSS is its own.
//   import-big-worker.ts <file> papa       papaparse alone, streaming chunks from disk
//   import-big-worker.ts <file> pipeline   detect → read → normalise → analyse, streamed from disk
import { createReadStream } from 'node:fs';
import Papa from 'papaparse';
import { createFileAnalyser } from '@/lib/pipeline/analyse-file';
import { registerFromTraps } from '@/lib/pipeline/trap-register';
import { rssSampler } from './common';
import { benchTrap, modelAProfile, tagOf } from './meter-text';

const [file, mode] = process.argv.slice(2);

function papa(): Promise<{ rows: number }> {
  return new Promise((resolve, reject) => {
    let rows = 0;
    Papa.parse<string[]>(createReadStream(file, { encoding: 'utf8', highWaterMark: 1 << 20 }) as unknown as File, {
      chunk: (r) => {
        rows += r.data.length;
      },
      complete: () => resolve({ rows }),
      error: reject,
    });
  });
}

async function pipeline() {
  let samples = 0;
  let tests = 0;
  const analyser = createFileAnalyser({
    fileName: 'big.csv', profile: modelAProfile(), timeZone: 'UTC',
    register: registerFromTraps(Array.from({ length: 1000 }, (_, i) => benchTrap(tagOf(i))), 'bench register'),
    onTest: (_a, t) => {
      samples += t.sampleCount;
      tests++;
    },
  });
  for await (const c of createReadStream(file, { highWaterMark: 1 << 20 })) analyser.push(c as Buffer);
  const result = analyser.end();
  const errors = result.problems.filter((p) => p.severity === 'error').length;
  return { tests, samples, errors };
}

async function main() {
  global.gc?.();
  const rss = rssSampler();
  const t0 = performance.now();
  const out = mode === 'papa' ? await papa() : await pipeline();
  const seconds = (performance.now() - t0) / 1000;
  rss.stop();
  console.log(JSON.stringify({ ...out, seconds, peakRss: rss.peak() }));
}

void main();

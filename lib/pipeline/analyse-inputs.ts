// Many inputs as one run (one upload, one survey): loose files and zips, each entry of a
// zip read within the zip limits (lib/import/zip-read.ts), then every reference check
// settled across the whole run. A run keeps only the small AnalysedTest records, so a
// caller may add one input at a time and let go of its bytes.

import { readZip, type ZipLimits } from '@/lib/import/zip-read';
import type { AnalysedTest } from './analysed-test';
import { analyseFile, type FileAnalysis, type RunOptions } from './analyse-file';
import { makeProblem, type PipelineProblem } from './problems';
import { settleTests, type SettleOptions } from './settle';

export interface ZipRunOptions extends RunOptions {
  zipLimits?: Partial<ZipLimits>;
}

export interface InputAnalysis {
  /** The input's name as given (a path on the command line, the uploaded file name). */
  name: string;
  isZip: boolean;
  /** One per loose file, or one per data entry of a zip. */
  files: FileAnalysis[];
  /** Problems of the zip itself (not of its entries): truncated, not a zip, unsafe names, skipped entries. */
  problems: PipelineProblem[];
  /** True when the input, or any entry of it, could not be read at all. */
  unreadable: boolean;
}

export interface RunAnalysis {
  inputs: InputAnalysis[];
  /** Every test of the run in input order, settled across the run. */
  tests: AnalysedTest[];
  /** Every problem in input order: a zip's own, then its entries'. */
  problems: PipelineProblem[];
  /** Names (with "› entry" for zip entries) of what could not be read at all. */
  unreadable: string[];
}

const ZIP_MAGIC = [0x50, 0x4b];

/** A zip by its name or its first bytes ("PK"), so a zip renamed .dat is still opened. */
export function looksLikeZip(name: string, bytes: Uint8Array): boolean {
  return /\.zip$/i.test(name) || (bytes.length >= 4 && bytes[0] === ZIP_MAGIC[0] && bytes[1] === ZIP_MAGIC[1] && bytes[2] === 3 && bytes[3] === 4);
}

/** Every data entry of a zip through the pipeline (settled per entry only). */
export function analyseZip(bytes: Uint8Array, opts: ZipRunOptions & { fileName: string }): InputAnalysis {
  const zip = readZip(bytes, opts.zipLimits ?? {}, opts.fileName);
  const problems: PipelineProblem[] = [...zip.problems];
  // Folder entries carry no data; everything else left out is said.
  for (const s of zip.skipped.filter((e) => !e.name.endsWith('/'))) {
    problems.push(makeProblem({ file: opts.fileName, entry: s.name }, 'zip-entry-skipped', 'warning', `left out: ${s.reason}`));
  }
  const files: FileAnalysis[] = [];
  for (const entry of zip.entries) {
    const read = entry.read();
    if (!read.ok) {
      problems.push(read.problem);
      continue;
    }
    files.push(analyseFile(read.bytes, { ...opts, fileName: opts.fileName, entry: entry.name, hints: entry.hints }));
  }
  const unreadable = problems.some((p) => p.severity === 'error') || files.some((f) => f.refused);
  return { name: opts.fileName, isZip: true, files, problems, unreadable };
}

export interface AnalysisRun {
  /** Analyses one loose file or zip; its verdicts are settled within it until finish(). */
  add(name: string, bytes: Uint8Array): InputAnalysis;
  /** Adds an input analysed elsewhere (e.g. streamed with createFileAnalyser). */
  addAnalysis(input: InputAnalysis): void;
  /** An input that could not be opened at all (a missing file): reported, counted unreadable. */
  addUnreadable(name: string, problem: PipelineProblem): void;
  /** Pairs references across every input added so far and settles every verdict. */
  finish(settle?: SettleOptions): RunAnalysis;
}

export function createAnalysisRun(opts: ZipRunOptions = {}): AnalysisRun {
  const inputs: InputAnalysis[] = [];
  return {
    add(name, bytes) {
      const input = looksLikeZip(name, bytes)
        ? analyseZip(bytes, { ...opts, fileName: name })
        : (() => {
            const f = analyseFile(bytes, { ...opts, fileName: name });
            return { name, isZip: false, files: [f], problems: [], unreadable: f.refused };
          })();
      inputs.push(input);
      return input;
    },
    addAnalysis(input) {
      inputs.push(input);
    },
    addUnreadable(name, problem) {
      inputs.push({ name, isZip: false, files: [], problems: [problem], unreadable: true });
    },
    finish(settle = {}) {
      const all = inputs.flatMap((i) => i.files.flatMap((f) => f.tests));
      const problems = inputs.flatMap((i) => [...i.problems, ...i.files.flatMap((f) => f.problems)]);
      const unreadable = inputs.flatMap((i) => [
        ...(i.isZip ? i.problems.filter((p) => p.severity === 'error').map((p) => (p.entry ? `${i.name} › ${p.entry}` : i.name)) : []),
        ...(!i.isZip && i.files.length === 0 ? [i.name] : []),
        ...i.files.filter((f) => f.refused).map((f) => (f.entry ? `${f.file} › ${f.entry}` : f.file)),
      ]);
      return { inputs, tests: settleTests(all, settle), problems, unreadable: [...new Set(unreadable)] };
    },
  };
}

/** All inputs as one run. */
export function analyseInputs(inputs: Iterable<{ name: string; bytes: Uint8Array }>, opts: ZipRunOptions = {}): RunAnalysis {
  const run = createAnalysisRun(opts);
  for (const i of inputs) run.add(i.name, i.bytes);
  return run.finish();
}

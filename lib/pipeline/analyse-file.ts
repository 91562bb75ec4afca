// One file (or zip entry) through the whole pipeline: detect the layout, choose the
// instrument profile, read the tests, analyse each test as it comes out of the reader,
// then settle the file's own reference checks. Streaming: a caller can push chunks and
// receive each test (with its series, for storage) as soon as it is analysed; only the
// small AnalysedTest records are kept.

import type { ParamOverrides } from '@/lib/analysis/defaults';
import { DETECT_SAMPLE_BYTES, detectLayout, detectShape, type LayoutDetection, type LayoutShape } from '@/lib/import/detect-layout';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import { createTestReader, type RowCounts, type TestReader } from '@/lib/import/read-tests';
import { measureTest, type AnalysedTest, type ProfileUsed } from './analysed-test';
import { chooseProfile, givenProfileFor, type ProfileChoice } from './choose-profile';
import { isRefusal, type PipelineProblem } from './problems';
import { settleTests } from './settle';
import type { TrapRegister } from './trap-register';

export interface RunOptions {
  /** One profile: it reads every file. Several: each file takes the one whose header it has (./choose-profile.ts). */
  profile?: InstrumentProfile | null;
  profiles?: readonly InstrumentProfile[];
  /** IANA zone for local times when the profile leaves it to the site. */
  timeZone?: string;
  register?: TrapRegister | null;
  params?: ParamOverrides;
  maxProblemsPerCode?: number;
}

export interface FileOptions extends RunOptions {
  fileName: string;
  entry?: string;
  hints?: string[];
  /**
   * Called with each test as soon as it is analysed, with its normalised series (for
   * storage). The verdict is provisional until the run is settled. If the file is
   * refused in the end (FileAnalysis.refused), discard what was handed out.
   */
  onTest?: (analysed: AnalysedTest, test: NormalisedTest) => void;
  /** The shape of this file's start, when the caller has read it already (detectShape of the same bytes). */
  shape?: LayoutShape;
}

export interface FileAnalysis {
  file: string;
  entry: string | null;
  /**
   * The full layout detection, made only when no given profile reads the file's shape
   * (./choose-profile.ts); null when one did, or when the file was never started.
   */
  detection: LayoutDetection | null;
  profileUsed: ProfileUsed | null;
  /** Settled within this file; settle again across the run (./analyse-inputs.ts) for references in other files. */
  tests: AnalysedTest[];
  problems: PipelineProblem[];
  /** True when the file yields no tests because it could not be read (an "error" problem). */
  refused: boolean;
  rowCounts: RowCounts | null;
}

export interface FileAnalyser {
  push(bytes: Uint8Array): void;
  end(): FileAnalysis;
}

function givenProfiles(opts: RunOptions): InstrumentProfile[] {
  return [...(opts.profile ? [opts.profile] : []), ...(opts.profiles ?? [])];
}

export function createFileAnalyser(opts: FileOptions): FileAnalyser {
  const place = { file: opts.fileName, entry: opts.entry ?? null };
  const problems: PipelineProblem[] = [];
  const tests: AnalysedTest[] = [];
  let head: Uint8Array[] = [];
  let headBytes = 0;
  let detection: LayoutDetection | null = null;
  let profileUsed: ProfileUsed | null = null;
  let reader: TestReader | null = null;
  let stopped = false;

  const start = (isWholeFile: boolean) => {
    const joined = new Uint8Array(headBytes);
    let o = 0;
    for (const c of head) {
      joined.set(c, o);
      o += c.length;
    }
    head = [];
    const sample = isWholeFile ? joined : joined.subarray(0, DETECT_SAMPLE_BYTES);
    const detectOptions = { fileName: opts.fileName, ...(opts.entry !== undefined ? { entry: opts.entry } : {}), isWholeFile };
    const given = givenProfiles(opts);
    const direct = givenProfileFor(opts.shape ?? detectShape(sample, detectOptions), given);
    let choice: ProfileChoice;
    if (direct) choice = { ok: true, profile: direct, source: 'given' };
    else {
      detection = detectLayout(sample, detectOptions);
      choice = chooseProfile(detection, given, place);
    }
    if (!choice.ok) {
      problems.push(...choice.problems);
      stopped = true;
      return;
    }
    profileUsed = {
      name: choice.profile.name,
      source: choice.source,
      layout: choice.profile.fingerprint ?? `profile:${choice.profile.name}`,
      referenceLink: choice.profile.referenceLink,
    };
    const profile = profileUsed;
    reader = createTestReader(choice.profile, {
      fileName: opts.fileName,
      ...(opts.entry !== undefined ? { entry: opts.entry } : {}),
      hints: opts.hints ?? [],
      ...(opts.timeZone !== undefined ? { timeZone: opts.timeZone } : {}),
      ...(opts.maxProblemsPerCode !== undefined ? { maxProblemsPerCode: opts.maxProblemsPerCode } : {}),
      onTest: (test) => {
        const { analysed, problem } = measureTest(test, { register: opts.register, params: opts.params, profile });
        if (problem) problems.push(problem);
        tests.push(analysed);
        opts.onTest?.(analysed, test);
      },
    });
    reader.push(joined);
  };

  return {
    push(bytes) {
      if (stopped || bytes.length === 0) return;
      if (reader) {
        reader.push(bytes);
        return;
      }
      head.push(bytes);
      headBytes += bytes.length;
      if (headBytes >= DETECT_SAMPLE_BYTES) start(false);
    },
    end(): FileAnalysis {
      if (!reader && !stopped) start(true);
      let rowCounts: RowCounts | null = null;
      if (reader) {
        const r = (reader as TestReader).end();
        rowCounts = r.rowCounts;
        // The reader's problems first (in file order), then the pipeline's own about tests.
        problems.unshift(...r.problems);
      }
      const refused = problems.some(isRefusal);
      return {
        file: opts.fileName,
        entry: opts.entry ?? null,
        detection,
        profileUsed,
        tests: refused ? [] : settleTests(tests),
        problems,
        refused,
        rowCounts,
      };
    },
  };
}

/** A whole file held in memory. */
export function analyseFile(bytes: Uint8Array, opts: FileOptions): FileAnalysis {
  const a = createFileAnalyser(opts);
  const step = 1 << 20;
  for (let i = 0; i < bytes.length; i += step) a.push(bytes.subarray(i, Math.min(bytes.length, i + step)));
  return a.end();
}

/** A file as a stream of chunks (a file on disk, an inflating zip entry). */
export async function analyseFileStream(chunks: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, opts: FileOptions): Promise<FileAnalysis> {
  const a = createFileAnalyser(opts);
  for await (const c of chunks) a.push(c);
  return a.end();
}

// Which instrument profile reads a file. The app recognises a layout by its header
// (BRIEF §3: "a header fingerprint recognises it on later uploads"); the command line
// takes profiles from --profile. Order:
//   1. a given profile whose fingerprint equals the file's;
//   2. a given profile with the same delimiter and header names (the reader's own test
//      of whether a file has a profile's layout, lib/import/read-tests.ts sameHeader);
//   3. the only given profile, when exactly one was given: the caller said it reads these
//      files, and if it does not the reader says so (header-mismatch) with the place;
//   4. the layout detection's suggested profile.
// Rules 1–3 need only the file's shape (lib/import/detect-layout.ts detectShape); the full
// detection, which reads many more rows, runs only when they find no profile.

import type { LayoutDetection, LayoutShape } from '@/lib/import/detect-layout';
import { normaliseWord } from '@/lib/import/header-vocabulary';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import { makeProblem, type PipelineProblem, type ProblemPlace } from './problems';

export type ProfileChoice =
  | { ok: true; profile: InstrumentProfile; source: 'given' | 'detected' }
  | { ok: false; problems: PipelineProblem[] };

function headerWords(header: readonly string[]): string[] {
  const out = header.map(normaliseWord);
  while (out.length && out[out.length - 1] === '') out.pop();
  return out;
}

function sameLayout(p: InstrumentProfile, d: LayoutShape): boolean {
  if (p.delimiter !== d.delimiter) return false;
  const a = headerWords(p.header);
  const b = headerWords(d.header);
  return a.length > 0 && a.length === b.length && a.every((w, i) => w === b[i]);
}

/** Rules 1–3: the given profile that reads a file of this shape, if any. */
export function givenProfileFor(shape: LayoutShape, given: readonly InstrumentProfile[]): InstrumentProfile | null {
  if (shape.ok) {
    const byPrint = given.find((p) => p.fingerprint !== undefined && p.fingerprint === shape.fingerprint);
    if (byPrint) return byPrint;
    const byHeader = given.find((p) => sameLayout(p, shape));
    if (byHeader) return byHeader;
  }
  return given.length === 1 ? given[0] : null;
}

/** Rule 4, once rules 1–3 found nothing: the detection's own suggestion, or why there is none. */
export function chooseProfile(detection: LayoutDetection, given: readonly InstrumentProfile[], place: ProblemPlace): ProfileChoice {
  const profile = givenProfileFor(detection, given);
  if (profile) return { ok: true, profile, source: 'given' };
  if (detection.suggestedProfile) return { ok: true, profile: detection.suggestedProfile, source: 'detected' };
  const refusals = detection.problems.filter((p) => p.severity === 'error');
  if (refusals.length) return { ok: false, problems: detection.problems };
  const m = detection.suggestedMapping;
  const missing = [!m?.time && 'a time', !m?.level && 'a level', !m?.tag && 'a tag'].filter(Boolean).join(', ');
  return {
    ok: false,
    problems: [
      ...detection.problems,
      makeProblem(place, 'layout-unknown', 'error', `the layout is not recognised: no column or preamble line was found for ${missing || 'the required fields'}`, {
        expected: given.length
          ? 'a file of the layout of one of the given instrument profiles'
          : 'time, level and tag columns; or map the layout in the app and pass its exported instrument profile with --profile',
      }),
    ],
  };
}

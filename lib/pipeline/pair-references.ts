// Pairs each trap test with a reference test on the adjacent pipe (BRIEF §4.5), across
// all files of one run (one upload, one survey): the reader links a reference to its
// trap's tag by the profile's rule; here the trap tests of that tag find it, wherever
// it was read from. Pure over the small AnalysedTest records; no series are needed.

import type { AnalysedTest } from './analysed-test';
import { tagKey } from './trap-register';

type Pairable = Pick<AnalysedTest, 'key' | 'file' | 'entry' | 'tag' | 'role' | 'linkedTrapTag' | 'startedAt' | 'durationS' | 'profile' | 'level'>;

export interface Pairing {
  /** Trap test key → the key of the reference test its check uses. */
  referenceOf: Map<string, string>;
  /** Reference test key → trap tag, for references linked here across files. */
  linkedAcrossFiles: Map<string, string>;
}

/** Seconds between two tests' spans; 0 when they overlap. */
function separationS(a: Pairable, b: Pairable): number {
  const aEnd = a.startedAt + a.durationS * 1000;
  const bEnd = b.startedAt + b.durationS * 1000;
  return Math.max(0, a.startedAt - bEnd, b.startedAt - aEnd) / 1000;
}

/**
 * A "previous-test" profile links a reference to the trap test right before it. The
 * reader can only do that within one file; a meter that writes one file per test puts
 * the reference in a file of its own (lib/import/reference-link.ts, linkReferences).
 * Here such a reference takes the latest trap test of the same layout that started
 * before it, in the whole run.
 */
function linkAcrossFiles(tests: readonly Pairable[]): Map<string, string> {
  const linked = new Map<string, string>();
  const byTime = [...tests].sort((a, b) => a.startedAt - b.startedAt);
  const lastTrapOfProfile = new Map<string, Pairable>();
  for (const t of byTime) {
    if (t.role === 'trap') lastTrapOfProfile.set(t.profile.layout, t);
    else if (t.linkedTrapTag === null && t.profile.referenceLink.by === 'previous-test') {
      const trap = lastTrapOfProfile.get(t.profile.layout);
      if (trap) linked.set(t.key, trap.tag);
    }
  }
  return linked;
}

/**
 * For each trap test, the reference test linked to its tag that lies nearest in time
 * (a trap tested twice in a run, as model B's split test, shares one reference; two
 * references for one trap go to the nearer test). Tags compare without regard to case.
 */
export function pairReferences(tests: readonly Pairable[]): Pairing {
  const linkedAcrossFiles = linkAcrossFiles(tests);
  const refsByTrap = new Map<string, Pairable[]>();
  for (const t of tests) {
    if (t.role !== 'reference') continue;
    const trapTag = t.linkedTrapTag ?? linkedAcrossFiles.get(t.key) ?? null;
    if (trapTag === null || !Number.isFinite(t.level.mean)) continue;
    const k = tagKey(trapTag);
    const list = refsByTrap.get(k);
    if (list) list.push(t);
    else refsByTrap.set(k, [t]);
  }
  const referenceOf = new Map<string, string>();
  for (const t of tests) {
    if (t.role !== 'trap') continue;
    const candidates = refsByTrap.get(tagKey(t.tag));
    if (!candidates) continue;
    // Nearest in time; between equally near ones, one from the same file (the same file
    // given twice, loose and in a zip, then pairs with itself).
    let best = candidates[0];
    for (const c of candidates) {
      const d = separationS(t, c) - separationS(t, best);
      if (d < 0 || (d === 0 && c.file === t.file && c.entry === t.entry && !(best.file === t.file && best.entry === t.entry))) best = c;
    }
    referenceOf.set(t.key, best.key);
  }
  return { referenceOf, linkedAcrossFiles };
}

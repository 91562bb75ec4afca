import type { ReferenceLink } from './instrument-profile';
import type { NormalisedTest } from './normalised-test';
import { preambleValue, type PreambleEntry } from './preamble';
import type { ProblemList } from './problems';

/**
 * Links each reference test (the probe on the adjacent pipe) to its trap,
 * however the meter names it (BRIEF §4.5 needs the pair for the reference
 * check). Trap tests are left alone.
 */

/** Profile patterns are matched without regard to case: meters and people differ in it. */
export function compileTagRegex(pattern: string): RegExp {
  return new RegExp(pattern, 'i');
}

/** The named group, else the first group, else the whole match; trimmed; null when empty. */
export function firstGroup(m: RegExpExecArray, name: string): string | null {
  const v = m.groups?.[name] ?? m[1] ?? m[0];
  const t = v?.trim();
  return t ? t : null;
}

export interface ReferenceLinker {
  setPreamble(entries: PreambleEntry[]): void;
  /** Sets linkedTrapTag of a reference test; call in the order the tests were taken. */
  link(test: NormalisedTest): void;
}

export function createReferenceLinker(rule: ReferenceLink, problems: ProblemList | null): ReferenceLinker {
  let preamble: PreambleEntry[] = [];
  let lastTrapTag: string | null = null;
  const regex = rule.by === 'tag-pattern' ? compileTagRegex(rule.pattern) : null;
  const unlinked = (test: NormalisedTest, why: string, expected: string) =>
    problems?.add(`the reference test ${test.tag} (lines ${test.source.firstLine}–${test.source.lastLine}) is not linked to a trap: ${why}`, {
      code: 'reference-unlinked',
      severity: 'warning',
      line: test.source.firstLine,
      expected,
    });
  return {
    setPreamble(entries) {
      preamble = entries;
    },
    link(test) {
      if (test.role === 'trap') {
        lastTrapTag = test.tag;
        return;
      }
      if (test.linkedTrapTag) return;
      switch (rule.by) {
        case 'same-tag':
          test.linkedTrapTag = test.tag;
          break;
        case 'tag-pattern': {
          const m = regex!.exec(test.tag);
          const trap = m ? firstGroup(m, 'trap') : null;
          if (trap) test.linkedTrapTag = trap;
          else unlinked(test, `its tag does not match /${rule.pattern}/`, 'a reference tag that names its trap');
          break;
        }
        case 'preamble': {
          const v = preambleValue(preamble, rule.key);
          if (v) test.linkedTrapTag = v;
          else unlinked(test, `the preamble has no "${rule.key}" line`, `a preamble line "${rule.key}: <trap tag>"`);
          break;
        }
        case 'previous-test':
          if (lastTrapTag) test.linkedTrapTag = lastTrapTag;
          else unlinked(test, 'no trap test comes before it', 'a trap test right before the reference test');
          break;
      }
    },
  };
}

/**
 * Links references across files, e.g. a meter that writes one file per test
 * and the reference file right after its trap's file. Give the tests of an
 * upload in the order they were taken (by startedAt); already-linked
 * references are kept.
 */
export function linkReferences(tests: NormalisedTest[], rule: ReferenceLink, preamble: PreambleEntry[] = []): NormalisedTest[] {
  const linker = createReferenceLinker(rule, null);
  linker.setPreamble(preamble);
  for (const t of [...tests].sort((a, b) => a.startedAt - b.startedAt)) linker.link(t);
  return tests;
}

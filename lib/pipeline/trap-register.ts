// What the register knows about each trap, looked up by tag for the analysis (BRIEF §3:
// trap type, line pressure, size, orifice, status). The command line builds it from a
// register CSV; the server builds it from the site's traps. Without an entry a trap is of
// unknown type and its line pressure is unknown, so no saturation check is made
// (issue 4, "Command line"); the lookup says so in words.

import type { TrapFacts } from '@/lib/analysis/analyse-test';
import type { TrapStatus, TrapType } from '@/lib/domain/vocabulary';
import { parseRegisterCsv } from '@/lib/import/register-csv';
import { makeProblem, type PipelineProblem, type PipelineProblemCode } from './problems';

export interface RegisterTrap {
  tag: string;
  trapType: TrapType;
  pressureBarg: number;
  sizeDn: number | null;
  orificeMm: number | null;
  status: TrapStatus;
}

export interface TrapRegister {
  /** Where the register came from (a file name, "site register"). */
  source: string;
  byTag: Map<string, RegisterTrap>;
}

export interface TrapLookup {
  inRegister: boolean;
  /** The register's tag spelling, when found. */
  tag: string | null;
  status: TrapStatus | null;
  facts: TrapFacts;
  /** Plain words for what the missing entry means, or for a removed trap. */
  notes: string[];
}

/** Tags are matched without regard to case or surrounding space, as the register import's duplicate check does. */
export function tagKey(tag: string): string {
  return tag.trim().toUpperCase();
}

export function registerFromTraps(traps: Iterable<RegisterTrap>, source: string): TrapRegister {
  const byTag = new Map<string, RegisterTrap>();
  for (const t of traps) byTag.set(tagKey(t.tag), t);
  return { source, byTag };
}

/**
 * Reads a register CSV (the format the app imports). Rows with problems are left out
 * and reported; the register is null when nothing usable is left (no required columns,
 * an empty file), which the caller should treat as unreadable.
 */
export function registerFromCsv(text: string, fileName: string): { register: TrapRegister | null; problems: PipelineProblem[] } {
  const parsed = parseRegisterCsv(text);
  const problems = parsed.problems.map((p) =>
    makeProblem({ file: fileName }, `register-${p.code.replace(/_/g, '-')}` as PipelineProblemCode, p.severity, p.message, {
      line: p.line,
      ...(p.column !== undefined ? { columnName: p.column } : {}),
    }),
  );
  const blocking = parsed.problems.some((p) => p.severity === 'error' && (p.code === 'empty_file' || p.code === 'missing_column' || p.code === 'duplicate_column'));
  if (blocking) return { register: null, problems };
  const register = registerFromTraps(
    parsed.rows.map(({ trap }) => ({
      tag: trap.tag,
      trapType: trap.trapType,
      pressureBarg: trap.pressureBarg,
      sizeDn: trap.sizeDn,
      orificeMm: trap.orificeMm,
      status: trap.status,
    })),
    fileName,
  );
  return { register, problems };
}

const UNKNOWN: TrapFacts = { type: null, pressureBarg: null, sizeDn: null, orificeMm: null, outOfService: false };

export function lookUpTrap(register: TrapRegister | null | undefined, tag: string | null): TrapLookup {
  if (!tag) {
    return { inRegister: false, tag: null, status: null, facts: { ...UNKNOWN }, notes: ['the test names no trap: type and line pressure unknown, no saturation check'] };
  }
  const t = register?.byTag.get(tagKey(tag));
  if (!t) {
    const why = register ? `${tag} is not in the register ${register.source}` : 'no register given';
    return {
      inRegister: false,
      tag: null,
      status: null,
      facts: { ...UNKNOWN },
      notes: [`${why}: trap of unknown type, line pressure unknown, so no saturation check and no steam-loss estimate`],
    };
  }
  const notes: string[] = [];
  // A removed trap that is still tested is treated like one out of service (row 1):
  // its figures are kept, but it is not judged as a working part of the line.
  if (t.status === 'removed') notes.push(`the register marks ${t.tag} removed; the test is judged as out of service`);
  return {
    inRegister: true,
    tag: t.tag,
    status: t.status,
    facts: { type: t.trapType, pressureBarg: t.pressureBarg, sizeDn: t.sizeDn, orificeMm: t.orificeMm, outOfService: t.status !== 'in_service' },
    notes,
  };
}

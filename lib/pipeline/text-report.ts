// The command line's default output: per file, a table of its tests (BRIEF §4 figures,
// issue 4 "Command line"), then each verdict's reasons and the notes, then the problems.
// Built from the JSON form (./test-json.ts), so the table and --json cannot disagree.

import type { RunAnalysis } from './analyse-inputs';
import { problemJson, testJson, type TestJson } from './test-json';

const COLUMNS = ['tag', 'role', 'start (UTC)', 'duration', 'mean level', 'duty cycle', 'intervals open/closed', 'surface', 'Tsat', 'verdict', 'loss'] as const;
const RIGHT = new Set<string>(['duration', 'mean level', 'duty cycle', 'intervals open/closed', 'surface', 'Tsat', 'loss']);

const dash = '–';
const fixed = (x: number | null, d: number, unit: string) => (x === null ? dash : `${x.toFixed(d)} ${unit}`);

function row(t: TestJson): string[] {
  const c = t.cycles;
  return [
    t.tag,
    t.role,
    t.startedAt.slice(0, 19).replace('T', ' '),
    fixed(t.durationS, 1, 's'),
    fixed(t.level.meanDb, 1, 'dB'),
    c.dutyCycle === null ? dash : `${Math.round(c.dutyCycle * 100)} %`,
    c.openIntervals === null ? dash : `${c.openIntervals}/${c.closedIntervals}`,
    fixed(t.temperature.medianC, 1, '°C'),
    fixed(t.temperature.tsatC, 1, '°C'),
    t.verdict.suggested === null ? '(reference)' : `${t.verdict.suggested}${t.verdict.confidence ? ` (${t.verdict.confidence})` : ''}`,
    t.loss.kgPerHour === null ? dash : `${t.loss.kgPerHour.toFixed(1)} kg/h`,
  ];
}

function table(rows: string[][]): string[] {
  const all = [[...COLUMNS], ...rows];
  const widths = COLUMNS.map((_, i) => Math.max(...all.map((r) => r[i].length)));
  const line = (r: string[]) =>
    r.map((cell, i) => (RIGHT.has(COLUMNS[i]) ? cell.padStart(widths[i]) : cell.padEnd(widths[i]))).join('  ').trimEnd();
  return [line(all[0]), widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(line)];
}

export interface TextReportOptions {
  registerSource: string | null;
  timeZone: string | null;
}

export function formatTextReport(run: RunAnalysis, opts: TextReportOptions): string {
  const out: string[] = [];
  out.push(
    opts.registerSource
      ? `Register: ${opts.registerSource}.`
      : 'No register given: every trap is of unknown type with no line pressure, so no saturation check (Tsat –) and no steam-loss estimate is made. Pass --register FILE.csv.',
  );
  if (opts.timeZone) out.push(`Local times without an offset are read in ${opts.timeZone} unless the profile names a zone.`);
  const byFile = new Map<string, TestJson[]>();
  for (const t of run.tests.map(testJson)) {
    const k = t.entry ? `${t.file} › ${t.entry}` : t.file;
    const list = byFile.get(k);
    if (list) list.push(t);
    else byFile.set(k, [t]);
  }
  // A note is printed once: "no register given" would otherwise follow every test.
  const noted = new Set<string>();
  for (const input of run.inputs) {
    for (const f of input.files) {
      const k = f.entry ? `${f.file} › ${f.entry}` : f.file;
      const tests = byFile.get(k) ?? [];
      out.push('', `${k}${f.profileUsed ? `  — profile "${f.profileUsed.name}" (${f.profileUsed.source})` : ''}`);
      if (f.refused) {
        out.push('  not read: see the problems below');
        continue;
      }
      out.push(...table(tests.map(row)).map((l) => `  ${l}`));
      for (const t of tests) {
        const why = t.verdict.reasons.join('; ');
        out.push(`  ${t.tag} ${t.startedAt.slice(11, 19)}: ${why}`);
        if (t.loss.kgPerHour !== null) out.push(`    loss ${t.loss.kgPerHour.toFixed(1)} kg/h, ${t.loss.tonnesPerYear?.toFixed(1)} t/yr (${t.loss.lossMode}, orifice ${t.loss.orificeMm} mm from ${t.loss.orificeSource}; ${t.loss.convention})`);
        for (const n of t.notes) {
          if (noted.has(n)) continue;
          noted.add(n);
          out.push(`    note: ${n}`);
        }
      }
    }
  }
  if (run.problems.length) {
    out.push('', 'Problems:');
    for (const p of run.problems.map(problemJson)) out.push(`  [${p.problem.severity}] ${p.problem.message}`);
  }
  out.push('', `${run.tests.length} test${run.tests.length === 1 ? '' : 's'} from ${run.inputs.length} input${run.inputs.length === 1 ? '' : 's'}${run.unreadable.length ? `; not readable: ${run.unreadable.join(', ')}` : ''}.`);
  return out.join('\n') + '\n';
}

import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { fixtureRegisterCsv, METER_FIXTURES, METERS } from './fixture-files';

/** The command line as a user runs it: a child process on the fixture files. */

const ROOT = join(__dirname, '../../..');
const dir = mkdtempSync(join(tmpdir(), 'plumeward-analyse-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function analyse(args: string[]) {
  const r = spawnSync(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/analyse.ts', ...args], { cwd: ROOT, encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

type Line = Record<string, any>;
function jsonLines(stdout: string): Line[] {
  return stdout.trim().split('\n').filter(Boolean).map((l) => JSON.parse(l));
}

const { csv, rows } = fixtureRegisterCsv();
const registerPath = join(dir, 'register.csv');
writeFileSync(registerPath, csv);
const profiles = [...new Set(METER_FIXTURES.map((f) => join(METERS, f.expected.profile)))];

describe('npm run analyse -- … --json', () => {
  const files = METER_FIXTURES.map((f) => f.path);
  const r = analyse([...files, ...profiles.flatMap((p) => ['--profile', p]), '--register', registerPath, '--time-zone', 'Europe/London', '--json']);
  const lines = jsonLines(r.stdout);
  const tests = lines.filter((l) => !('problem' in l));
  const problems = lines.filter((l) => 'problem' in l).map((l) => l.problem);

  it('exits 0 and prints one JSON object per line', () => {
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(lines.length).toBeGreaterThan(0);
  });

  it('prints every fixture test with its tag, role, start and sample count', () => {
    const want = METER_FIXTURES.flatMap((f) => f.expected.tests.map((e) => [f.path, e.tag, e.role, e.startedAt, e.sampleCount]));
    expect(tests.map((t) => [t.file, t.tag, t.role, t.startedAt, t.sampleCount])).toEqual(want);
    for (const t of tests) expect(t.startedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
  });

  it('pairs every linked reference with its trap test, and the check feeds the verdict', () => {
    for (const ref of tests.filter((t) => t.role === 'reference')) {
      const traps = tests.filter((t) => t.role === 'trap' && t.tag === ref.linkedTrapTag);
      expect(traps.length).toBeGreaterThan(0);
      expect(traps.some((t) => t.reference.tag === ref.tag && t.reference.startedAt === ref.startedAt)).toBe(true);
      expect(ref.verdict.suggested).toBeNull();
    }
    for (const t of tests.filter((x) => x.reference.available)) {
      expect(t.reference.differenceDb).toBeCloseTo(t.level.meanDb - t.reference.meanDb, 3);
      if (t.verdict.suggested === 'background_noise') expect(t.reference.clearlyLouder).toBe(false);
    }
  });

  it('takes types and pressures from the register: saturation and loss are computed', () => {
    const verdicts = new Set<string>();
    for (const t of tests.filter((x) => x.role === 'trap')) {
      const row = rows.get(t.tag)!;
      expect(t.trap).toMatchObject({ inRegister: true, type: row.type, pressureBarg: row.pressureBarg, sizeDn: row.sizeDn });
      expect(t.temperature.tsatC).toBeGreaterThan(140);
      expect(t.verdict.reasons.length).toBeGreaterThan(0);
      verdicts.add(t.verdict.suggested);
      if (t.verdict.suggested === 'blowing' || t.verdict.suggested === 'leaking') {
        expect(t.loss.kgPerHour).toBeGreaterThan(0);
        expect(t.loss.tonnesPerYear).toBeCloseTo((t.loss.kgPerHour * 8000) / 1000, 0);
      } else expect(t.loss.kgPerHour).toBeNull();
    }
    expect(tests.some((t) => t.loss.kgPerHour !== null)).toBe(true);
    expect(verdicts.size).toBeGreaterThan(1);
  });

  it('prints the planted problems as problem lines with file and line', () => {
    const want = METER_FIXTURES.flatMap((f) => f.expected.problems.map((p) => [f.path, p.code, p.line]));
    expect(problems.filter((p) => p.code !== 'encoding-guessed').map((p) => [p.file, p.code, p.line])).toEqual(want);
    for (const p of problems) {
      expect(Object.keys(p)).toEqual(['code', 'severity', 'file', 'entry', 'line', 'column', 'message']);
      expect(p.message.startsWith(p.file)).toBe(true);
    }
  });

  it('every test line has the same keys', () => {
    const keys = (o: Line): string[] => Object.entries(o).flatMap(([k, v]) => (v && typeof v === 'object' && !Array.isArray(v) ? [k, ...keys(v).map((s) => `${k}.${s}`)] : [k]));
    const first = keys(tests[0]).sort();
    for (const t of tests) expect(keys(t).sort()).toEqual(first);
  });
});

describe('npm run analyse on a zip, without a profile or register', () => {
  const r = analyse([join(METERS, 'zips/day-2025-04-08.zip'), '--time-zone', 'Europe/London', '--json']);
  const lines = jsonLines(r.stdout);
  const tests = lines.filter((l) => !('problem' in l));

  it('reads each data entry with its detected layout and pairs the model A reference from its own entry', () => {
    expect(r.status).toBe(0);
    expect(new Set(tests.map((t) => t.entry))).toEqual(new Set(['2025-04-08/Evaporator Hall/A_FV-EVP-031_20250408T091403.csv', '2025-04-08/Evaporator Hall/A_FV-EVP-031-REF_20250408T091452.csv', '2025-04-08/CIP Kitchen/B_2025-04-08.csv']));
    expect(tests.every((t) => t.profile.source === 'detected')).toBe(true);
    const trap = tests.find((t) => t.tag === 'FV-EVP-031')!;
    expect(trap.reference.tag).toBe('FV-EVP-031-REF');
  });

  it('says the traps are of unknown type with no saturation check', () => {
    for (const t of tests) {
      expect(t.trap.inRegister).toBe(false);
      expect(t.temperature.tsatC).toBeNull();
      expect(t.notes.join(' ')).toMatch(/no register given.*no saturation check/);
    }
  });

  it('lists the entries it left out', () => {
    const skipped = lines.filter((l) => l.problem?.code === 'zip-entry-skipped').map((l) => l.problem.entry);
    expect(skipped).toContain('2025-04-08/CIP Kitchen/valve photo.jpg');
  });
});

describe('npm run analyse as a table', () => {
  it('prints a table per file with the figures, the verdicts and their reasons', () => {
    const f = METER_FIXTURES.find((x) => x.fileName === 'B_2025-04-08.csv')!;
    const r = analyse([f.path, '--register', registerPath, '--time-zone', 'Europe/London']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/tag\s+role\s+start \(UTC\)\s+duration\s+mean level\s+duty cycle\s+intervals open\/closed\s+surface\s+Tsat\s+verdict\s+loss/);
    for (const e of f.expected.tests) expect(r.stdout).toContain(e.tag);
    expect(r.stdout).toMatch(/FV-CIP-007\s+trap\s+2025-04-08 08:30:00\s+19\.8 s\s+28\.4 dB/);
    expect(r.stdout).toContain('Problems:');
    expect(r.stdout).toContain(`${f.path}, line 305`);
  });

  it('says when no register was given', () => {
    const r = analyse([METER_FIXTURES[0].path, '--time-zone', 'Europe/London']);
    expect(r.stdout).toMatch(/No register given: every trap is of unknown type.*no saturation check/);
  });
});

describe('npm run analyse on what cannot be read', () => {
  it('a missing file exits non-zero and says which and why', () => {
    const missing = join(dir, 'not-there.csv');
    const r = analyse([missing, '--json']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain(`cannot read ${missing}: no such file`);
    expect(jsonLines(r.stdout)[0].problem).toMatchObject({ code: 'file-missing', severity: 'error', file: missing });
  });

  it('a PNG renamed .csv exits non-zero with a clear message, and the other files are still analysed', () => {
    const png = join(dir, 'trap-photo.csv');
    copyFileSync(join(METERS, 'bad/photo.csv'), png);
    const good = METER_FIXTURES.find((x) => x.fileName.startsWith('A_FV-EVP-032'))!;
    const r = analyse([png, good.path, '--json']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain(`could not read 1 input: ${png}`);
    const lines = jsonLines(r.stdout);
    expect(lines[0].problem).toMatchObject({ code: 'file-not-text', severity: 'error', file: png });
    expect(lines[0].problem.message).toBe(`${png}: this is a PNG image, not a meter export; expected delimited text (CSV, semicolon, tab or pipe separated)`);
    expect(lines.filter((l) => !('problem' in l)).map((l) => l.tag)).toEqual(['FV-EVP-032']);
  });

  it('a truncated zip exits non-zero', () => {
    const r = analyse([join(METERS, 'zips/truncated.zip'), '--json']);
    expect(r.status).toBe(1);
    expect(jsonLines(r.stdout)[0].problem.code).toBe('zip-truncated');
  });

  it('a wrong command line, profile or register exits 2 with the reason', () => {
    expect(analyse([]).status).toBe(2);
    const badProfile = join(dir, 'bad.profile.json');
    writeFileSync(badProfile, '{"format":"something-else"}');
    const p = analyse([METER_FIXTURES[0].path, '--profile', badProfile]);
    expect(p.status).toBe(2);
    expect(p.stderr).toContain('format: expected "plumeward.instrument-profile"');
    const badRegister = join(dir, 'bad-register.csv');
    writeFileSync(badRegister, 'tag,area\nX,Y\n');
    const g = analyse([METER_FIXTURES[0].path, '--register', badRegister]);
    expect(g.status).toBe(2);
    expect(g.stderr).toMatch(/Required column "trap_type" is missing/);
  });
});

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseFile, analyseFileStream, createFileAnalyser } from '@/lib/pipeline/analyse-file';
import { analyseInputs } from '@/lib/pipeline/analyse-inputs';
import { registerFromCsv } from '@/lib/pipeline/trap-register';
import { fixtureRegisterCsv, loadProfile, METER_FIXTURES, METERS } from './fixture-files';

const { csv, rows } = fixtureRegisterCsv();
const register = registerFromCsv(csv, 'register.csv').register!;

describe.each(METER_FIXTURES)('$rel', ({ fileName, expected, bytes }) => {
  const profile = loadProfile(expected.profile);
  const withProfile = analyseFile(bytes, { fileName, profile, timeZone: expected.timeZone, register });

  it('gives every expected test with its tag, role, start and sample count, analysed', () => {
    expect(withProfile.refused).toBe(false);
    expect(withProfile.profileUsed?.source).toBe('given');
    // The profile reads the file's shape, so no full detection was made.
    expect(withProfile.detection).toBeNull();
    expect(withProfile.tests.map((t) => [t.tag, t.role, new Date(t.startedAt).toISOString(), t.sampleCount])).toEqual(
      expected.tests.map((e) => [e.tag, e.role, e.startedAt, e.sampleCount]),
    );
    withProfile.tests.forEach((t, i) => {
      expect(t.level.mean).toBeCloseTo(expected.tests[i].levelDb.mean, 3);
      expect(t.analysis).not.toBeNull();
      expect(t.settled).toBe(true);
    });
  });

  it('passes the reader’s problems through, with their lines', () => {
    expect(withProfile.problems.filter((p) => p.code !== 'encoding-guessed').map((p) => ({ code: p.code, line: p.line }))).toEqual(expected.problems);
  });

  it('takes trap type and line pressure from the register, so the saturation check is made', () => {
    for (const t of withProfile.tests) {
      const tag = t.role === 'trap' ? t.tag : t.linkedTrapTag;
      const row = tag ? rows.get(tag) : undefined;
      if (!row) continue;
      expect(t.trap.inRegister).toBe(true);
      expect(t.trap.facts.type).toBe(row.type);
      expect(t.analysis!.temperature.tsatC).not.toBeNull();
    }
  });

  it('without a profile uses the detected layout’s suggestion and reads the same tests', () => {
    const detected = analyseFile(bytes, { fileName, timeZone: expected.timeZone, register });
    expect(detected.profileUsed?.source).toBe('detected');
    expect(detected.profileUsed?.name).toBe(detected.detection?.suggestedProfile?.name);
    expect(detected.tests.map((t) => [t.tag, t.role, t.startedAt, t.sampleCount])).toEqual(withProfile.tests.map((t) => [t.tag, t.role, t.startedAt, t.sampleCount]));
  });

  it('gives the same analysis fed in small chunks, and hands out each test with its series as it is analysed', async () => {
    const seen: Array<[string, number]> = [];
    const chunks = Array.from({ length: Math.ceil(bytes.length / 613) }, (_, i) => bytes.subarray(i * 613, (i + 1) * 613));
    const streamed = await analyseFileStream(chunks, {
      fileName, profile, timeZone: expected.timeZone, register,
      onTest: (analysed, test) => {
        expect(analysed.settled).toBe(false);
        expect(test.levelDb.length).toBe(analysed.sampleCount);
        seen.push([analysed.key, test.levelDb.length]);
      },
    });
    expect(seen.map(([k]) => k)).toEqual(withProfile.tests.map((t) => t.key));
    expect(streamed.tests.map((t) => t.analysis?.verdict)).toEqual(withProfile.tests.map((t) => t.analysis?.verdict));
  });
});

describe('without a register', () => {
  const f = METER_FIXTURES.find((x) => x.fileName.startsWith('A_FV-EVP-032'))!;
  const r = analyseFile(f.bytes, { fileName: f.fileName, timeZone: 'UTC' });

  it('a trap is of unknown type, no saturation check is made, no loss estimated, and the result says so', () => {
    const t = r.tests[0];
    expect(t.trap.inRegister).toBe(false);
    expect(t.trap.facts.type).toBeNull();
    expect(t.analysis!.temperature.tsatC).toBeNull();
    expect(t.analysis!.temperature.cold).toBeNull();
    expect(t.notes.join(' ')).toMatch(/no register given: trap of unknown type.*no saturation check/);
    // Blowing is still seen from the sound alone; the loss needs the line pressure.
    expect(t.analysis!.verdict.code).toBe('blowing');
    expect(t.analysis!.loss).toBeNull();
    expect(t.analysis!.lossNote).toMatch(/no line pressure/);
  });

  it('a tag missing from a given register is named', () => {
    const reg = registerFromCsv('tag,trap_type,pressure_barg\nFV-EVP-999,inverted_bucket,6\n', 'reg.csv').register!;
    const t = analyseFile(f.bytes, { fileName: f.fileName, register: reg }).tests[0];
    expect(t.notes[0]).toMatch(/FV-EVP-032 is not in the register reg\.csv/);
  });
});

describe('files that cannot be analysed', () => {
  const modelA = loadProfile('model-a/model-a.profile.json');

  it('a one-reading test with no rate is reported and kept, not crashed on', () => {
    const bytes = new TextEncoder().encode('utc_time,trap_tag,ultrasound_db,surface_temp_c\n2025-04-08T10:00:00.000Z,FV-EVP-050,41.5,150.0\n');
    const r = analyseFile(bytes, { fileName: 'A_FV-EVP-050.csv', profile: modelA });
    expect(r.refused).toBe(false);
    expect(r.tests).toHaveLength(1);
    expect(r.tests[0].analysis).toBeNull();
    expect(r.tests[0].notAnalysed).toMatch(/single reading/);
    expect(r.tests[0].level.mean).toBeCloseTo(41.5, 4);
    expect(r.problems.map((p) => [p.code, p.line])).toEqual([['test-single-sample', 2], ['test-not-analysed', 2]]);
    expect(r.problems[1].message).toMatch(/^A_FV-EVP-050\.csv, line 2: the test of FV-EVP-050 is not analysed/);
  });

  it('a refused file yields no tests, even those handed out while streaming', () => {
    const handed: string[] = [];
    const a = createFileAnalyser({ fileName: 'cut.csv', profile: modelA, onTest: (t) => handed.push(t.key) });
    a.push(new TextEncoder().encode('utc_time,trap_tag,ultrasound_db,surface_temp_c\n2025-04-08T10:00:00.000Z,FV-EVP-050,41.5,150.0\n"unterminated'));
    const r = a.end();
    expect(r.refused).toBe(true);
    expect(r.tests).toEqual([]);
    expect(r.problems.some((p) => p.code === 'csv-unterminated-quote' && p.severity === 'error')).toBe(true);
  });

  it.each([
    ['photo.csv', 'file-not-text', /PNG image, not a meter export/],
    ['empty.csv', 'file-empty', /empty/],
    ['header-only.csv', 'file-header-only', /no data rows/],
  ])('bad/%s is refused with %s', (name, code, message) => {
    const run = analyseInputs([{ name, bytes: new Uint8Array(readFileSync(join(METERS, 'bad', name))) }]);
    expect(run.unreadable).toEqual([name]);
    const p = run.problems.find((x) => x.severity === 'error')!;
    expect(p.code).toBe(code);
    expect(p.message).toMatch(message);
    expect(p.message.startsWith(name)).toBe(true);
  });
});

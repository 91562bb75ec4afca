import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseInstrumentProfile, type InstrumentProfile, type InstrumentProfileInput } from '@/lib/import/instrument-profile';
import { readTests, readTestsFromStream } from '@/lib/import/read-tests';
import { linkReferences } from '@/lib/import/reference-link';
import { readZip } from '@/lib/import/zip-read';

const ROOT = join(__dirname, '../../../fixtures/meters');
const fixture = (rel: string) => new Uint8Array(readFileSync(join(ROOT, rel)));
const profileFile = (rel: string): InstrumentProfile => {
  const r = parseInstrumentProfile(readFileSync(join(ROOT, rel), 'utf8'));
  if (!r.ok) throw new Error(r.issues.join('; '));
  return r.profile;
};
const modelA = profileFile('model-a/model-a.profile.json');
const utf8 = (s: string) => new TextEncoder().encode(s);

function profile(over: Partial<InstrumentProfileInput>): InstrumentProfile {
  const r = parseInstrumentProfile({
    format: 'plumeward.instrument-profile',
    version: 1,
    name: 'test layout',
    delimiter: ',',
    decimalMark: '.',
    header: ['t', 'tag', 'db'],
    time: { kind: 'epoch', column: 0, unit: 's' },
    level: { column: 2, unit: 'dB' },
    temperature: null,
    tag: { from: 'column', column: 1 },
    role: { from: 'none' },
    referenceLink: { by: 'same-tag' },
    ...over,
  });
  if (!r.ok) throw new Error(r.issues.join('; '));
  return r.profile;
}

function rows(spec: [number, string, number][]): string {
  return `t,tag,db\n${spec.map(([t, tag, db]) => `${t},${tag},${db}`).join('\n')}\n`;
}

describe('bad files are refused with one clear problem', () => {
  it.each([
    ['bad/empty.csv', 'file-empty', 'the file is empty (0 bytes)'],
    ['bad/blank-lines.csv', 'file-empty', 'only blank lines'],
    ['bad/header-only.csv', 'file-header-only', 'header row but no data rows'],
    ['bad/photo.csv', 'file-not-text', 'this is a PNG image, not a meter export'],
    ['bad/unterminated-quote.csv', 'csv-unterminated-quote', 'never closed'],
  ])('%s', (rel, code, words) => {
    const r = readTests(fixture(rel), modelA, { fileName: rel.split('/')[1] });
    expect(r.tests).toEqual([]);
    const errors = r.problems.filter((p) => p.severity === 'error');
    expect(errors.map((p) => p.code)).toEqual([code]);
    expect(errors[0].message).toContain(words);
    expect(errors[0].message.startsWith(rel.split('/')[1])).toBe(true);
    expect(errors[0].expected).toBeTruthy();
  });

  it('reads a non-UTF-8 file as Windows-1252 when the profile says auto, and says so', () => {
    const r = readTests(fixture('bad/latin1-tag.csv'), modelA, { fileName: 'latin1-tag.csv' });
    expect(r.encoding).toBe('windows-1252');
    expect(r.tests.map((t) => t.tag)).toEqual(['FV-EVP-03é']);
    expect(r.problems.map((p) => p.code)).toEqual(['encoding-guessed', 'test-single-sample']);
  });

  it('refuses it when the profile insists on UTF-8, naming the encoding', () => {
    const r = readTests(fixture('bad/latin1-tag.csv'), { ...modelA, encoding: 'utf-8' }, { fileName: 'latin1-tag.csv' });
    expect(r.tests).toEqual([]);
    expect(r.problems.map((p) => p.code)).toEqual(['encoding-invalid']);
    expect(r.problems[0].message).toContain('not valid UTF-8');
  });

  it('refuses a file whose header is not the profile\'s, quoting the expected header', () => {
    const r = readTests(utf8('time,where,loud\n1,a,2\n'), modelA, { fileName: 'other.csv' });
    expect(r.problems.map((p) => p.code)).toEqual(['header-mismatch']);
    expect(r.problems[0].expected).toContain('utc_time,trap_tag,ultrasound_db,surface_temp_c');
  });

  it('refuses a file where no row could be read', () => {
    const r = readTests(utf8('t,tag,db\nx,A-1,3\ny,A-1,4\n'), profile({}), { fileName: 'x.csv' });
    expect(r.tests).toEqual([]);
    expect(r.problems.map((p) => p.code)).toEqual(['time-invalid', 'time-invalid', 'file-no-readings']);
  });
});

describe('grouping readings into tests', () => {
  it('starts a new test when the tag changes, and when a gap exceeds max(5 s, 10 periods)', () => {
    // 1 Hz: the gap limit is 10 s. A 9 s gap stays, an 11 s gap splits.
    const spec: [number, string, number][] = [];
    for (let i = 0; i < 5; i++) spec.push([1000 + i, 'A-1', 20]);
    spec.push([1013, 'A-1', 20]); // +9 s
    spec.push([1024, 'A-1', 20]); // +11 s
    spec.push([1025, 'B-2', 30]);
    const r = readTests(utf8(rows(spec)), profile({}), { fileName: 'g.csv' });
    expect(r.tests.map((t) => [t.tag, t.sampleCount, t.source.firstLine])).toEqual([
      ['A-1', 6, 2],
      ['A-1', 1, 8],
      ['B-2', 1, 9],
    ]);
    expect(r.problems.map((p) => [p.code, p.line])).toEqual([
      ['test-split-gap', 8],
      ['test-single-sample', 8],
      ['test-single-sample', 9],
    ]);
    expect(r.tests[0].timeOffsetsS).not.toBeNull(); // the 9 s gap makes it irregular
  });

  it('uses the 5 s floor at fast rates', () => {
    const spec: [number, string, number][] = [];
    for (let i = 0; i < 20; i++) spec.push([1000 + i * 0.1, 'A-1', 20]);
    spec.push([1001.9 + 4.9, 'A-1', 20]); // a 4.9 s gap at 10 Hz: kept
    spec.push([1006.8 + 5.1, 'A-1', 20]); // 5.1 s: split
    const r = readTests(utf8(rows(spec)), profile({}), { fileName: 'g.csv' });
    expect(r.tests.map((t) => t.sampleCount)).toEqual([21, 1]);
  });

  it('sorts small backwards steps, collapses repeated times and says where', () => {
    const r = readTests(utf8(rows([[10, 'A-1', 1], [10.5, 'A-1', 2], [10.25, 'A-1', 3], [10.5, 'A-1', 4], [10.75, 'A-1', 5]])), profile({}), { fileName: 'g.csv' });
    const t = r.tests[0];
    expect(Array.from(t.levelDb)).toEqual([1, 3, 2, 5]);
    expect(t.sampleRateHz).toBeCloseTo(4, 9);
    expect(t.timeOffsetsS).toBeNull();
    expect([t.duplicatesCollapsed, t.backwardsJumps]).toEqual([1, 1]);
    expect(r.problems.map((p) => [p.code, p.line])).toEqual([
      ['time-backwards', 4],
      ['time-duplicate', 5],
    ]);
    expect(r.problems[1].message).toContain('same time as line 3');
    expect(r.rowCounts).toMatchObject({ dataRows: 5, readings: 4, duplicates: 1, skipped: 0 });
  });

  it('applies the level offset and records zip hints on each test', () => {
    const r = readTests(utf8(rows([[1, 'A-1', 40], [2, 'A-1', 41]])), profile({ levelOffsetDb: -2 }), { fileName: 'day.zip', entry: '2025-04-08/Boiler House/x.csv', hints: ['2025-04-08', 'Boiler House'] });
    expect(Array.from(r.tests[0].levelDb)).toEqual([38, 39]);
    expect(r.tests[0].source).toEqual({ file: 'day.zip', entry: '2025-04-08/Boiler House/x.csv', hints: ['2025-04-08', 'Boiler House'], firstLine: 2, lastLine: 3 });
  });

  it('reports an unknown point role with the values it expected', () => {
    const text = 't,tag,point,db\n1,A-1,trap,20\n2,A-1,valve,20\n';
    const r = readTests(utf8(text), profile({ header: ['t', 'tag', 'point', 'db'], level: { column: 3, unit: 'dB' }, role: { from: 'column', column: 2, trapValues: ['trap'], referenceValues: ['pipe'] } }), { fileName: 'r.csv' });
    expect(r.problems[0]).toMatchObject({ code: 'role-unknown', line: 3, column: 3, columnName: 'point', expected: 'one of "trap", "pipe"', found: 'valve' });
  });

  it('caps listed problems per kind and says how many more there were', () => {
    const text = `t,tag,db\n${Array.from({ length: 30 }, (_, i) => `${i},A-1,x`).join('\n')}\n1000,A-1,3\n`;
    const r = readTests(utf8(text), profile({}), { fileName: 'many.csv', maxProblemsPerCode: 10 });
    expect(r.problems.filter((p) => p.code === 'level-invalid')).toHaveLength(10);
    const summary = r.problems.find((p) => p.code === 'file-too-many-problems');
    expect(summary?.message).toContain('20 more problems of kind "level-invalid" (30 in all)');
    expect(r.rowCounts.skipped).toBe(30);
  });
});

describe('time zones in the reader', () => {
  const local = profile({ header: ['t', 'tag', 'db'], time: { kind: 'datetime', column: 0, timeColumn: null, order: 'ymd', zone: null } });
  const text = 't,tag,db\n2025-04-08 09:30:00,A-1,1\n2025-04-08 09:30:01,A-1,2\n';

  it("reads local times in the site's zone", () => {
    const r = readTests(utf8(text), local, { fileName: 'z.csv', timeZone: 'Europe/London' });
    expect(r.tests[0].startedAt).toBe(Date.UTC(2025, 3, 8, 8, 30));
  });

  it('refuses local times when no zone is known', () => {
    const r = readTests(utf8(text), local, { fileName: 'z.csv' });
    expect(r.problems.map((p) => p.code)).toEqual(['time-zone-missing']);
    expect(r.tests).toEqual([]);
  });

  it('needs no zone for times that carry their offset', () => {
    const r = readTests(utf8('t,tag,db\n2025-04-08T09:30:00+01:00,A-1,1\n'), local, { fileName: 'z.csv' });
    expect(r.tests[0].startedAt).toBe(Date.UTC(2025, 3, 8, 8, 30));
  });

  it('refuses an unknown zone name', () => {
    const r = readTests(utf8(text), local, { fileName: 'z.csv', timeZone: 'Europe/Atlantis' });
    expect(r.problems.map((p) => p.code)).toEqual(['time-zone-unknown']);
  });
});

describe('streams and zips', () => {
  it('reads a zip entry streamed while it inflates, with the same result as the whole file', async () => {
    const zip = readZip(fixture('zips/day-2025-04-08.zip'));
    const entry = zip.entries.find((e) => e.baseName === 'B_2025-04-08.csv')!;
    const b = profileFile('model-b/model-b.profile.json');
    const opts = { fileName: 'day.zip', entry: entry.name, hints: entry.hints, timeZone: 'Europe/London' };
    const streamed = await readTestsFromStream(entry.chunks(), b, opts);
    const whole = readTests(fixture('model-b/B_2025-04-08.csv'), b, opts);
    expect(streamed.tests.map((t) => [t.tag, t.role, t.sampleCount, t.startedAt])).toEqual(whole.tests.map((t) => [t.tag, t.role, t.sampleCount, t.startedAt]));
    expect(streamed.tests[0].source.hints).toEqual(['2025-04-08', 'CIP Kitchen']);
    expect(streamed.problems[0].message.startsWith('day.zip › 2025-04-08/CIP Kitchen/B_2025-04-08.csv, line')).toBe(true);
  });

  it('hands out tests one by one through onTest, keeping none', () => {
    const seen: string[] = [];
    const r = readTests(fixture('model-b/B_2025-04-08.csv'), profileFile('model-b/model-b.profile.json'), { fileName: 'B.csv', timeZone: 'Europe/London', onTest: (t) => void seen.push(`${t.tag}:${t.role}`) });
    expect(r.tests).toEqual([]);
    expect(seen).toEqual(['FV-CIP-007:trap', 'FV-CIP-007:reference', 'FV-CIP-009:trap', 'FV-CIP-009:trap', 'FV-CIP-009:reference', 'FV-CIP-011:trap']);
  });

  it('links a reference file to the trap file before it across files', () => {
    const p = profile({ role: { from: 'tag-pattern', pattern: '^PIPE' }, referenceLink: { by: 'previous-test' } });
    const trap = readTests(utf8(rows([[100, 'SM-TRC-112', 50], [101, 'SM-TRC-112', 51]])), p, { fileName: 'a.csv' });
    const ref = readTests(utf8(rows([[130, 'PIPE-1', 20], [131, 'PIPE-1', 21]])), p, { fileName: 'b.csv' });
    expect(ref.problems.map((x) => x.code)).toEqual(['reference-unlinked']);
    const all = linkReferences([...ref.tests, ...trap.tests], p.referenceLink);
    expect(all.map((t) => [t.tag, t.role, t.linkedTrapTag])).toEqual([
      ['PIPE-1', 'reference', 'SM-TRC-112'],
      ['SM-TRC-112', 'trap', null],
    ]);
  });
});

import { describe, expect, it } from 'vitest';
import { analyseInputs } from '@/lib/pipeline/analyse-inputs';
import { problemJson, runJsonLines, testJson } from '@/lib/pipeline/test-json';
import { loadProfile, METER_FIXTURES } from './fixture-files';

const keys = (o: object): string[] =>
  Object.entries(o).flatMap(([k, v]) => (v && typeof v === 'object' && !Array.isArray(v) ? [k, ...keys(v).map((s) => `${k}.${s}`)] : [k])).sort();

describe('the JSON shape', () => {
  const modelA = loadProfile('model-a/model-a.profile.json');
  const one = new TextEncoder().encode('utc_time,trap_tag,ultrasound_db,surface_temp_c\n2025-04-08T10:00:00.000Z,FV-EVP-050,41.5,150.0\n');
  const files = METER_FIXTURES.filter((f) => f.rel.startsWith('model-a/'));
  const run = analyseInputs([...files.map((f) => ({ name: f.fileName, bytes: f.bytes })), { name: 'A_FV-EVP-050.csv', bytes: one }], { profile: modelA });
  const lines = run.tests.map(testJson);

  it('has the same keys for an analysed trap test, a reference test and a test that could not be analysed', () => {
    const kinds = [lines.find((l) => l.role === 'reference')!, lines.find((l) => l.tag === 'FV-EVP-031')!, lines.find((l) => l.tag === 'FV-EVP-050')!];
    for (const k of kinds) expect(keys(k)).toEqual(keys(kinds[1]));
  });

  it('gives the unanalysable one-reading test an inconclusive verdict with the reason, and no figures it cannot have', () => {
    const t = lines.find((l) => l.tag === 'FV-EVP-050')!;
    expect(t.verdict).toMatchObject({ suggested: 'inconclusive', row: null, confidence: 'low' });
    expect(t.verdict.reasons[0]).toMatch(/single reading with no sample rate/);
    expect(t.level.meanDb).toBe(41.5);
    expect(t.cycles.dutyCycle).toBeNull();
    expect(t.loss.kgPerHour).toBeNull();
  });

  it('gives a reference test no verdict, and says whose check it served', () => {
    const r = lines.find((l) => l.role === 'reference')!;
    expect(r.verdict.suggested).toBeNull();
    expect(r.verdict.reasons[0]).toMatch(/adjacent pipe of FV-EVP-031.*1 trap test$/);
    expect(r.reference.servesTrapTests).toBe(1);
  });

  it('survives a JSON round trip unchanged (no NaN, no typed arrays)', () => {
    for (const l of lines) expect(JSON.parse(JSON.stringify(l))).toEqual(l);
  });

  it('orders the lines per input: problems of a file before its tests', () => {
    const out = runJsonLines(run);
    const i = out.findIndex((o) => 'problem' in o && o.problem.code === 'test-not-analysed');
    const j = out.findIndex((o) => 'tag' in o && o.tag === 'FV-EVP-050');
    expect(i).toBeGreaterThanOrEqual(0);
    expect(j).toBeGreaterThan(i);
    expect(problemJson(run.problems[0]).problem.file).toBe(run.problems[0].file);
  });
});

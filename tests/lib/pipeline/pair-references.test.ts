import { describe, expect, it } from 'vitest';
import type { AnalysedTest } from '@/lib/pipeline/analysed-test';
import { analyseInputs } from '@/lib/pipeline/analyse-inputs';
import { pairReferences } from '@/lib/pipeline/pair-references';
import { settleTests } from '@/lib/pipeline/settle';
import { loadProfile, METER_FIXTURES } from './fixture-files';

type T = Parameters<typeof pairReferences>[0][number];
const T0 = Date.UTC(2025, 3, 8, 9);
function rec(key: string, tag: string, role: 'trap' | 'reference', startMin: number, linked: string | null = null, layout = 'L', by: 'same-tag' | 'previous-test' = 'same-tag'): T {
  return {
    key, file: `${key}.csv`, entry: null, tag, role, linkedTrapTag: linked, startedAt: T0 + startMin * 60_000, durationS: 20,
    profile: { name: layout, source: 'given', layout, referenceLink: { by } },
    level: { count: 10, mean: 20, median: 20, sd: 0, p10: 20, p90: 20, min: 20, max: 20, lag1Autocorrelation: null },
  };
}

describe('pairReferences', () => {
  it('pairs across files by the linked tag, without regard to case, nearest in time', () => {
    const p = pairReferences([
      rec('t1', 'FV-EVP-031', 'trap', 0),
      rec('t2', 'FV-EVP-031', 'trap', 120),
      rec('r1', 'FV-EVP-031-REF', 'reference', 2, 'fv-evp-031'),
      rec('r2', 'X-9', 'reference', 118, 'FV-EVP-031'),
      rec('t3', 'FV-EVP-033', 'trap', 5),
    ]);
    expect(Object.fromEntries(p.referenceOf)).toEqual({ t1: 'r1', t2: 'r2' });
  });

  it('links a "previous-test" reference in a file of its own to the latest trap test of its layout before it', () => {
    const p = pairReferences([
      rec('t1', 'SM-TRC-114', 'trap', 0, null, 'D', 'previous-test'),
      rec('o1', 'SM-TRC-300', 'trap', 1, null, 'other', 'same-tag'),
      rec('r1', 'SM-TRC-114-T', 'reference', 2, null, 'D', 'previous-test'),
    ]);
    expect(Object.fromEntries(p.linkedAcrossFiles)).toEqual({ r1: 'SM-TRC-114' });
    expect(Object.fromEntries(p.referenceOf)).toEqual({ t1: 'r1' });
  });

  it('leaves a trap without a reference unpaired', () => {
    expect(pairReferences([rec('t1', 'A', 'trap', 0), rec('r1', 'B', 'reference', 1, 'B')]).referenceOf.size).toBe(0);
  });
});

describe('a run over many files', () => {
  const inputs = METER_FIXTURES.filter((f) => f.rel.startsWith('model-a/') || f.rel.startsWith('layout-d/')).map((f) => ({ name: f.fileName, bytes: f.bytes }));
  const profiles = [loadProfile('model-a/model-a.profile.json'), loadProfile('layout-d/layout-d.profile.json')];
  const run = analyseInputs(inputs, { profiles, timeZone: 'Europe/London' });
  const byTag = (tag: string) => run.tests.find((t) => t.tag === tag)!;

  it('pairs references read from other files than their trap tests', () => {
    const trap = byTag('FV-EVP-031');
    const ref = byTag('FV-EVP-031-REF');
    expect(trap.file).not.toBe(ref.file);
    expect(trap.reference?.key).toBe(ref.key);
    expect(trap.analysis!.reference.available).toBe(true);
    expect(trap.analysis!.reference.referenceMeanDb).toBeCloseTo(ref.level.mean, 9);
    expect(ref.servesTrapTests).toEqual([trap.key]);
    const d = byTag('SM-TRC-114');
    expect(d.reference?.key).toBe(byTag('SM-TRC-114-T').key);
  });

  it('a file analysed alone does not see the reference in the other file; the run does', () => {
    const alone = analyseInputs(inputs.filter((i) => !i.name.includes('-REF')), { profiles });
    expect(alone.tests.find((t) => t.tag === 'FV-EVP-031')!.analysis!.reference.available).toBe(false);
  });

  it('settling again changes nothing (idempotent)', () => {
    const again = settleTests(run.tests as AnalysedTest[]);
    expect(again.map((t) => t.analysis?.verdict)).toEqual(run.tests.map((t) => t.analysis?.verdict));
    expect(again.map((t) => t.reference)).toEqual(run.tests.map((t) => t.reference));
  });
});

// The demo's meter files (lib/demo): the same inputs give the same bytes; the files read with
// the fixture profiles of model A and model B; and the analysis suggests the verdict each
// trap was generated to show (docs/verdict-table.md), reference checks included.
import { createHash } from 'node:crypto';
import { describe, expect, it, vi } from 'vitest';
import { demoSurveyFiles, type DemoMeterFile } from '@/lib/demo/meter-files';
import { INTENDED_VERDICT, IN_PROGRESS_SHARE, SURVEY_PHASES, routeOf, type Condition, type DemoSiteCode, type DemoSurveySpec, type PlannedTest } from '@/lib/demo/survey-plan';
import { readTests } from '@/lib/import/read-tests';
import { zoneOffsetMs } from '@/lib/import/time-zone';
import { analyseInputs } from '@/lib/pipeline/analyse-inputs';
import { registerFromTraps } from '@/lib/pipeline/trap-register';
import { loadProfile } from '../pipeline/fixture-files';
import { demoLikeRegister } from './demo-register';

const traps = demoLikeRegister();
const register = registerFromTraps(traps.map((t) => ({ ...t, sizeDn: 20, orificeMm: null })), 'demo register');
const ZONE: Record<DemoSiteCode, string> = { FV: 'Europe/London', SM: 'Europe/Amsterdam' };
const PROFILE = { FV: loadProfile('model-a/model-a.profile.json'), SM: loadProfile('model-b/model-b.profile.json') };
const START = { first_spring: '2025-04-14', second_spring: '2026-04-13', in_progress: '2026-11-30' } as const;
const spec = (site: DemoSiteCode, phase: DemoSurveySpec['phase']): DemoSurveySpec => ({ site, phase, startsOn: START[phase], timeZone: ZONE[site] });

const SURVEYS = (['FV', 'SM'] as const).flatMap((site) => SURVEY_PHASES.map((phase) => ({ site, phase, ...demoSurveyFiles(traps, spec(site, phase)) })));
const digest = (files: DemoMeterFile[]) => {
  const h = createHash('sha256');
  for (const f of files) h.update(f.name).update(f.bytes);
  return h.digest('hex');
};

describe('determinism', () => {
  it('gives the same files, byte for byte, for the same register and survey', () => {
    for (const s of SURVEYS) expect(digest(demoSurveyFiles(traps, spec(s.site, s.phase)).files)).toBe(digest(s.files));
  });

  it('never calls Math.random', () => {
    const spy = vi.spyOn(Math, 'random').mockImplementation(() => {
      throw new Error('Math.random called');
    });
    try {
      expect(() => demoSurveyFiles(traps, spec('FV', 'second_spring'))).not.toThrow();
    } finally {
      spy.mockRestore();
    }
  });

  it('keeps a trap’s story when another trap leaves the register', () => {
    const fewer = traps.filter((t) => t.tag !== 'FV-EVP-002');
    const before = demoSurveyFiles(traps, spec('FV', 'first_spring')).plan;
    const after = demoSurveyFiles(fewer, spec('FV', 'first_spring')).plan;
    const conditions = (plan: PlannedTest[]) => new Map(plan.filter((p) => p.condition !== 'background_noise').map((p) => [p.trap.tag, p.condition]));
    const a = conditions(after);
    for (const [tag, c] of conditions(before)) if (a.has(tag)) expect(a.get(tag)).toBe(c);
  });
});

describe('coverage of the register', () => {
  it.each(SURVEYS.map((s) => [s.site, s.phase, s] as const))('%s %s: one trap test per in-service trap, 40 %% of the route in progress', (site, phase, s) => {
    const route = routeOf(traps, site);
    expect(s.plan.map((p) => p.trap.tag)).toEqual(route.map((t) => t.tag));
    const imported = s.plan.filter((p) => p.part === 'imported').length;
    expect(imported).toBe(phase === 'in_progress' ? Math.round(route.length * IN_PROGRESS_SHARE) : route.length);
    expect(s.plan.every((p) => p.trap.status === 'in_service')).toBe(true);
    expect(s.plan.filter((p) => p.condition === 'background_noise')).toHaveLength(1);
  });

  it('has every condition of the story somewhere, mostly working', () => {
    const all = SURVEYS.flatMap((s) => s.plan.filter((p) => p.part === 'imported'));
    const count = (c: Condition) => all.filter((p) => p.condition === c).length;
    for (const c of Object.keys(INTENDED_VERDICT) as Condition[]) expect(count(c), c).toBeGreaterThan(0);
    expect(count('working') / all.length).toBeGreaterThan(0.75);
  });

  it('tells a story: one area worse from spring to spring, another better, failed traps repaired', () => {
    const rate = (site: DemoSiteCode, phase: 'first_spring' | 'second_spring', area: string) => {
      const plan = SURVEYS.find((s) => s.site === site && s.phase === phase)!.plan.filter((p) => p.trap.area === area);
      return plan.filter((p) => INTENDED_VERDICT[p.condition] !== 'working' && p.condition !== 'background_noise').length / plan.length;
    };
    expect(rate('FV', 'second_spring', 'Evaporator Hall')).toBeGreaterThan(rate('FV', 'first_spring', 'Evaporator Hall') + 0.08);
    expect(rate('FV', 'second_spring', 'Spray Dryer')).toBeLessThan(rate('FV', 'first_spring', 'Spray Dryer') - 0.08);
    expect(rate('SM', 'second_spring', 'Line Tracing')).toBeGreaterThan(rate('SM', 'first_spring', 'Line Tracing'));
    expect(rate('SM', 'second_spring', 'Tank Heating')).toBeLessThan(rate('SM', 'first_spring', 'Tank Heating'));
    const second = new Map(SURVEYS.find((s) => s.site === 'FV' && s.phase === 'second_spring')!.plan.map((p) => [p.trap.tag, p.condition]));
    const repaired = SURVEYS.find((s) => s.site === 'FV' && s.phase === 'first_spring')!.plan
      .filter((p) => !['working', 'background_noise'].includes(p.condition) && second.get(p.trap.tag) === 'working');
    expect(repaired.length).toBeGreaterThan(5);
  });
});

describe.each(SURVEYS.map((s) => [s.site, s.phase, s] as const))('%s %s: the files', (site, phase, s) => {
  const profile = PROFILE[site];
  const read = s.files.map((f) => ({ file: f, result: readTests(f.bytes, profile, { fileName: f.name, timeZone: ZONE[site] }) }));

  it('read with the fixture profile of the site’s meter model, without a problem', () => {
    for (const { file, result } of read) {
      expect(result.problems.filter((p) => p.code !== 'encoding-guessed'), file.name).toEqual([]);
      expect(result.tests.length).toBeGreaterThan(0);
    }
    // Model A: one file per test; model B: one day file per surveying day.
    if (site === 'FV') expect(read.every(({ result }) => result.tests.length === 1)).toBe(true);
    else expect(s.files.every((f) => /^B_\d{4}-\d{2}-\d{2}\.csv$/.test(f.name))).toBe(true);
  });

  it('give each planned placement as one test: tag, role, link, start, rate and 10–60 s', () => {
    const tests = read.flatMap(({ result }) => result.tests);
    const expected = s.plan.flatMap((p) => [
      { tag: p.trap.tag, role: 'trap', linkedTrapTag: null, startedAt: p.test.startedAt, durationS: p.test.durationS },
      ...(p.reference
        ? [{ tag: site === 'FV' ? `${p.trap.tag}-REF` : p.trap.tag, role: 'reference', linkedTrapTag: p.trap.tag, startedAt: p.reference.startedAt, durationS: p.reference.durationS }]
        : []),
    ]);
    const key = (t: { tag: string; role: string; startedAt: number }) => `${t.startedAt}|${t.tag}|${t.role}`;
    expect(tests.map((t) => ({ tag: t.tag, role: t.role, linkedTrapTag: t.linkedTrapTag, startedAt: t.startedAt, durationS: t.durationS })).sort((a, b) => key(a).localeCompare(key(b))))
      .toEqual(expected.sort((a, b) => key(a).localeCompare(key(b))));
    for (const t of tests) {
      expect(t.timeOffsetsS).toBeNull();
      expect(t.sampleRateHz).toBe(site === 'FV' ? 10 : 5);
      expect(t.durationS).toBeGreaterThanOrEqual(10);
      expect(t.durationS).toBeLessThanOrEqual(60);
    }
  });

  it('are made in working hours of the survey’s days, local time', () => {
    const first = Date.parse(`${START[phase]}T00:00:00Z`);
    for (const p of s.plan) {
      const local = p.test.startedAt + zoneOffsetMs(ZONE[site], p.test.startedAt);
      const hour = (local % 86_400_000) / 3_600_000;
      expect(hour).toBeGreaterThanOrEqual(8);
      expect(hour).toBeLessThan(16.5);
      const day = Math.floor((local - first) / 86_400_000);
      expect(day).toBeGreaterThanOrEqual(0);
      expect(day).toBeLessThan(4);
    }
  });
});

describe.each(SURVEYS.map((s) => [s.site, s.phase, s] as const))('%s %s: the analysis', (site, _phase, s) => {
  const imported = s.files.filter((f) => f.part === 'imported');
  const run = analyseInputs(imported, { profile: PROFILE[site], timeZone: ZONE[site], register });
  const trapTests = new Map(run.tests.filter((t) => t.role === 'trap').map((t) => [t.tag, t]));
  const planned = s.plan.filter((p) => p.part === 'imported');

  it('suggests for every trap the verdict it was generated to show', () => {
    const got = planned.map((p) => [p.trap.tag, p.condition, trapTests.get(p.trap.tag)?.analysis?.verdict.code]);
    expect(got).toEqual(planned.map((p) => [p.trap.tag, p.condition, INTENDED_VERDICT[p.condition]]));
  });

  it('pairs each reference test with its trap; the noisy pipe is as loud as its trap', () => {
    for (const p of planned.filter((x) => x.reference)) {
      const t = trapTests.get(p.trap.tag)!;
      expect(t.analysis!.reference.available).toBe(true);
      const difference = t.analysis!.reference.differenceDb!;
      if (p.condition === 'background_noise') expect(Math.abs(difference)).toBeLessThan(6);
      else expect(difference).toBeGreaterThan(15);
    }
  });

  it('reads surfaces near the saturation temperature of the line, and near ambient for cold traps', () => {
    for (const p of planned) {
      const temperature = trapTests.get(p.trap.tag)!.analysis!.temperature;
      expect(temperature.tsatC).toBeCloseTo(p.tsatC, 6);
      if (p.condition === 'cold') expect(Math.abs(temperature.surfaceC! - 20)).toBeLessThan(12);
      else if (p.condition === 'backing_up') expect(temperature.beyondAllowance).toBe(true);
      else expect(temperature.beyondAllowance).toBe(false);
    }
  });
});

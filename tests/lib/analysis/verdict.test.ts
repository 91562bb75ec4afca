// Every row of the decision table (BRIEF §4a, docs/verdict-table.md) reproduced
// end to end: a synthetic test signal → analyseTest → suggested verdict.
// Sources beside each case; "common practice, no source" where that is all there is.
import { describe, expect, it } from 'vitest';
import { analyseTest, type TestAnalysis, type TrapFacts } from '@/lib/analysis/analyse-test';
import type { ParamOverrides } from '@/lib/analysis/defaults';
import { regularTimebase } from '@/lib/analysis/timebase';
import type { TrapType } from '@/lib/analysis/trap-types';
import { FAILED_VERDICTS, VERDICT_CODES, compareSeverity, isFailed, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { makeSignal, periodicOpenings, type SignalSpec } from './synthetic-signal';

interface Scenario {
  type: TrapType | null;
  signal: Partial<SignalSpec>;
  /** One surface temperature for the whole test, °C; null: the meter had none. */
  surfaceC?: number | null;
  pressureBarg?: number | null;
  trap?: Partial<TrapFacts>;
  referenceMeanDb?: number | null;
  note?: boolean;
  params?: ParamOverrides;
}

function run(s: Scenario): TestAnalysis {
  const spec: SignalSpec = { rateHz: 10, durationS: 30, openings: [], closedDb: 12, openDb: 12, noiseDb: 0.5, seed: 2, ...s.signal };
  const { level } = makeSignal(spec);
  const surface = s.surfaceC === undefined ? 180 : s.surfaceC;
  const temperatureC = surface === null ? null : new Float32Array(level.length).fill(surface);
  return analyseTest(
    {
      timebase: regularTimebase(spec.rateHz),
      levelDb: level,
      temperatureC,
      trap: { type: s.type, pressureBarg: s.pressureBarg === undefined ? 10 : s.pressureBarg, ...s.trap },
      lineOutOfServiceNote: s.note,
      referenceMeanDb: s.referenceMeanDb,
    },
    s.params,
  );
}

const quiet: Partial<SignalSpec> = { closedDb: 12, openDb: 12 };
const steady = (db: number): Partial<SignalSpec> => ({ closedDb: db, openDb: db });
// A disc trap that opens and snaps shut about every 10 s (NAVFAC MO-209 Table 3-2 [read]).
const discCycling = (closedDb: number, openDb = 60): Partial<SignalSpec> => ({
  durationS: 40,
  openings: periodicOpenings(3, 10, 1.2, 40),
  closedDb,
  openDb,
});

function expectVerdict(result: TestAnalysis, code: VerdictCode, row: number) {
  expect({ code: result.verdict.code, row: result.verdict.row }).toEqual({ code, row });
  expect(result.verdict.reasons.length).toBeGreaterThan(0);
}

describe('row 1: out of service', () => {
  it('the register says so', () => {
    expectVerdict(run({ type: 'inverted_bucket', signal: quiet, trap: { outOfService: true } }), 'out_of_service', 1);
  });
  it('a field note says so', () => {
    expectVerdict(run({ type: 'thermodynamic_disc', signal: discCycling(15), note: true }), 'out_of_service', 1);
  });
  it('a cold, quiet trap on a line marked out of service is out of service, not cold (issue 4)', () => {
    const r = run({ type: 'thermodynamic_disc', signal: quiet, surfaceC: 22, trap: { outOfService: true } });
    expectVerdict(r, 'out_of_service', 1);
    expect(r.verdict.failed).toBe(false);
  });
});

describe('row 2: cold', () => {
  it('surface nearer ambient than saturation and quiet (MO-209 §2.3: no discharge and cold means trouble)', () => {
    const r = run({ type: 'inverted_bucket', signal: quiet, surfaceC: 26 });
    expectVerdict(r, 'cold', 2);
    expect(r.verdict.confidence).toBe('high');
    expect(r.verdict.reasons.join(' ')).toMatch(/26\.0 °C.*184\.1 °C at 10\.0 barg/);
  });
  it('a cool trap with flow is not cold', () => {
    expect(run({ type: 'float_thermostatic', signal: steady(40), surfaceC: 60 }).verdict.code).not.toBe('cold');
  });
});

describe('row 3: background noise — re-check', () => {
  it('flow, but the trap is only 3 dB louder than the adjacent pipe', () => {
    const r = run({ type: 'thermodynamic_disc', signal: steady(45), referenceMeanDb: 42 });
    expectVerdict(r, 'background_noise', 3);
    expect(r.reference.differenceDb!).toBeCloseTo(3, 0);
    expect(r.verdict.failed).toBe(false);
  });
  it('exactly at the margin counts as clearly louder', () => {
    const r = run({ type: 'thermodynamic_disc', signal: { ...steady(45), noiseDb: 0 }, referenceMeanDb: 39 });
    expect(r.reference.clearlyLouder).toBe(true);
    expect(r.verdict.code).not.toBe('background_noise');
  });
  it('refinement: a quiet, hot trap beside a quiet pipe is working (row 8), not background noise', () => {
    expectVerdict(run({ type: 'thermodynamic_disc', signal: quiet, referenceMeanDb: 11 }), 'working', 8);
  });
});

describe('row 4: blowing', () => {
  it('live steam throughout with no closed interval', () => {
    const r = run({ type: 'thermodynamic_disc', signal: steady(70) });
    expectVerdict(r, 'blowing', 4);
    expect(r.verdict.lossMode).toBe('blow_through');
    expect(r.verdict.reasons).toContain('no closed interval in 30 s');
    expect(r.verdict.reasons).toContain('level in the live-steam band (≥ 52.0 dB) 100 % of the time');
    expect(r.verdict.reasons).toContain('a thermodynamic disc trap should close between discharges');
    expect(r.loss?.severityFactor).toBe(1);
  });
  it('live steam only 70 % of the time is not blowing', () => {
    const r = run({ type: 'thermodynamic_disc', signal: { closedDb: (t) => (t < 9 ? 45 : 70), openDb: 70 } });
    expect(r.bands.shares.liveSteam).toBeLessThan(0.8);
    expect(r.verdict.code).not.toBe('blowing');
  });
});

describe('row 5: backing up', () => {
  it('a flowing float trap 44 K below saturation (allowance 10 K)', () => {
    const r = run({ type: 'float_thermostatic', signal: steady(40), surfaceC: 140 });
    expectVerdict(r, 'backing_up', 5);
    expect(r.temperature.subcoolingK!).toBeCloseTo(44.1, 1);
  });
  it('balanced-pressure thermostatic 40 K subcooled: beyond 10 + 15 K', () => {
    expectVerdict(run({ type: 'thermostatic_balanced_pressure', signal: steady(35), surfaceC: 144 }), 'backing_up', 5);
  });
  it('bimetallic thermostatic 40 K subcooled: within 10 + 35 K, so it is working by design', () => {
    const r = run({ type: 'thermostatic_bimetallic', signal: steady(35), surfaceC: 144 });
    expect(r.temperature.beyondAllowance).toBe(false);
    expectVerdict(r, 'working', 7);
  });
});

describe('row 6: cycling traps seen cycling', () => {
  it('a disc trap that opens and snaps shut about every 10 s is working (NAVFAC MO-209 Table 3-2)', () => {
    const r = run({ type: 'thermodynamic_disc', signal: discCycling(15) });
    expectVerdict(r, 'working', 6);
    expect(r.verdict.confidence).toBe('high');
  });
  it('flash steam at the outlet is normal: a loud discharge that closes tight is working (MO-209 §2.3.1)', () => {
    const r = run({ type: 'thermodynamic_disc', signal: discCycling(15, 75) });
    expect(r.cycles.openIntervals.every((iv) => iv.maxDb > 52)).toBe(true);
    expectVerdict(r, 'working', 6);
  });
  it('closed at 34 dB, above the quiet band: leaking (common practice, no source: a closed trap is quiet)', () => {
    const r = run({ type: 'inverted_bucket', signal: discCycling(34) });
    expectVerdict(r, 'leaking', 6);
    expect(r.verdict.lossMode).toBe('leaking');
    expect(r.loss?.severityFactor).toBe(0.25);
  });
  it('a disc trap cycling 80 times a minute: leaking by rapid cycling (MO-209: over 60 times/min)', () => {
    const r = run({ type: 'thermodynamic_disc', signal: { rateHz: 20, openings: periodicOpenings(0.5, 0.75, 0.3, 30), closedDb: 15, openDb: 55 } });
    expect(r.cycles.cyclesPerMinute).toBeGreaterThan(60);
    expectVerdict(r, 'leaking', 6);
    expect(r.verdict.lossMode).toBe('rapid_cycling');
    expect(r.loss?.severityFactor).toBe(0.2);
  });
  it('an inverted bucket opening every 3 s: leaking by rapid cycling (MO-209: faster than every 5 s)', () => {
    const r = run({ type: 'inverted_bucket', signal: { openings: periodicOpenings(1, 3, 0.8, 30), closedDb: 14, openDb: 50 } });
    expect(r.cycles.meanCyclePeriodS!).toBeCloseTo(3, 1);
    expectVerdict(r, 'leaking', 6);
    expect(r.verdict.lossMode).toBe('rapid_cycling');
  });
  it('an inverted bucket opening every 8 s is working', () => {
    expectVerdict(run({ type: 'inverted_bucket', signal: { openings: periodicOpenings(1, 8, 1.5, 30), closedDb: 14, openDb: 50 } }), 'working', 6);
  });
  it('a thermostatic trap discharging in batches and closing quietly is working', () => {
    expectVerdict(run({ type: 'thermostatic_balanced_pressure', signal: discCycling(12, 40), surfaceC: 170 }), 'working', 6);
  });
  it('refinement: a quiet disc trap with no temperature is not called working by row 6', () => {
    expectVerdict(run({ type: 'thermodynamic_disc', signal: quiet, surfaceC: null }), 'inconclusive', 9);
  });
});

describe('row 7: flow with no closed interval', () => {
  it('a float and thermostatic trap modulating steadily is working (MO-209 §2.3.1: continuous discharge)', () => {
    expectVerdict(run({ type: 'float_thermostatic', signal: steady(40) }), 'working', 7);
  });
  it('refinement: a float trap whose flow surges and eases (dips read as closures) is still working', () => {
    const r = run({ type: 'float_thermostatic', signal: { openings: periodicOpenings(2, 6, 2, 30), closedDb: 36, openDb: 48 } });
    expect(r.cycles.closedIntervals.length).toBeGreaterThan(0);
    expectVerdict(r, 'working', 7);
  });
  it('a thermostatic trap discharging steadily in the condensate band is working', () => {
    expectVerdict(run({ type: 'thermostatic_balanced_pressure', signal: steady(38), surfaceC: 175 }), 'working', 7);
  });
  it('a disc trap flowing continuously for 15 s: inconclusive, re-test longer', () => {
    const r = run({ type: 'thermodynamic_disc', signal: { ...steady(42), durationS: 15 } });
    expectVerdict(r, 'inconclusive', 7);
    expect(r.verdict.reasons.join(' ')).toMatch(/re-test for longer/);
    expect(r.loss).toBeNull();
  });
  it('a disc trap flowing continuously for 30 s: leaking', () => {
    const r = run({ type: 'thermodynamic_disc', signal: steady(42) });
    expectVerdict(r, 'leaking', 7);
    expect(r.loss?.lossMode).toBe('leaking');
  });
  it('an inverted bucket flowing continuously for 30 s: leaking', () => {
    expectVerdict(run({ type: 'inverted_bucket', signal: steady(44) }), 'leaking', 7);
  });
});

describe('row 8: quiet throughout and hot', () => {
  it.each(['thermodynamic_disc', 'inverted_bucket', 'float_thermostatic', 'thermostatic_bimetallic'] as const)(
    '%s: closed, and a closed trap is a good trap',
    (type) => {
      const r = run({ type, signal: quiet, surfaceC: 178 });
      expectVerdict(r, 'working', 8);
      expect(r.verdict.confidence).toBe('high');
    },
  );
});

describe('row 9: anything else', () => {
  it('quiet with no surface temperature: a closed trap cannot be told from a cold one', () => {
    const r = run({ type: 'inverted_bucket', signal: quiet, surfaceC: null });
    expectVerdict(r, 'inconclusive', 9);
    expect(r.verdict.confidence).toBe('low');
    expect(r.verdict.reasons[0]).toMatch(/surface temperature/);
  });
  it('quiet with no line pressure', () => {
    expect(run({ type: 'inverted_bucket', signal: quiet, pressureBarg: null }).verdict.reasons[0]).toMatch(/line pressure/);
  });
  it('unknown trap type with steady flow', () => {
    const r = run({ type: null, signal: steady(40) });
    expectVerdict(r, 'inconclusive', 9);
    expect(r.verdict.reasons[0]).toMatch(/type unknown/);
  });
  it('a thermostatic trap with steady flow mostly in the live-steam band, short of blowing', () => {
    const r = run({ type: 'thermostatic_bimetallic', signal: { ...steady(52.5), noiseDb: 1.5 } });
    expect(r.cycles.continuousFlow).toBe(true);
    expect(r.bands.shares.liveSteam).toBeGreaterThan(0.5);
    expect(r.bands.shares.liveSteam).toBeLessThan(0.8);
    expectVerdict(r, 'inconclusive', 9);
  });
});

describe('verdict order and the failed set (BRIEF §4a)', () => {
  it('worst first: blowing, leaking, backing up, cold, background noise, inconclusive, out of service, working', () => {
    const shuffled: VerdictCode[] = ['working', 'cold', 'inconclusive', 'blowing', 'out_of_service', 'background_noise', 'backing_up', 'leaking'];
    expect([...shuffled].sort(compareSeverity)).toEqual([
      'blowing', 'leaking', 'backing_up', 'cold', 'background_noise', 'inconclusive', 'out_of_service', 'working',
    ]);
  });
  it('failed = blowing, leaking, backing up, cold', () => {
    expect(VERDICT_CODES.filter(isFailed)).toEqual(['blowing', 'leaking', 'backing_up', 'cold']);
    expect(FAILED_VERDICTS.size).toBe(4);
  });
  it('no steam-loss figure for failures that do not pass steam (cold, backing up)', () => {
    expect(run({ type: 'inverted_bucket', signal: quiet, surfaceC: 26 }).loss).toBeNull();
    expect(run({ type: 'float_thermostatic', signal: steady(40), surfaceC: 140 }).loss).toBeNull();
  });
  it('a blowing trap with no line pressure has no loss figure and says why', () => {
    const r = run({ type: 'thermodynamic_disc', signal: steady(70), pressureBarg: null });
    expect(r.verdict.code).toBe('blowing');
    expect(r.loss).toBeNull();
    expect(r.lossNote).toMatch(/line pressure/);
  });
});

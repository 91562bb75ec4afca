// Bands with their precedence, the temperature assessment and the reference check
// (BRIEF §4a defaults: quiet ≤ 25 dB, live steam ≥ 52 dB; subcooling allowances;
// 6 dB margin).
import { describe, expect, it } from 'vitest';
import { bandShares, resolveBands } from '@/lib/analysis/bands';
import { DEFAULT_PARAMS, resolveParams } from '@/lib/analysis/defaults';
import { checkReference } from '@/lib/analysis/reference-check';
import { assessTemperature } from '@/lib/analysis/temperature';
import { irregularTimebase, regularTimebase } from '@/lib/analysis/timebase';

describe('bands', () => {
  it('defaults: quiet ≤ 25 dB, live steam ≥ 52 dB, set by the trap-type layer', () => {
    expect(resolveBands('inverted_bucket', DEFAULT_PARAMS.bands)).toEqual({
      quietMaxDb: 25,
      liveSteamMinDb: 52,
      source: { quietMaxDb: 'trap_type_default', liveSteamMinDb: 'trap_type_default' },
    });
  });

  it('precedence: trap-type default < instrument profile < site override, per limit', () => {
    const p = resolveParams({
      bands: {
        byTrapType: { thermodynamic_disc: { quietMaxDb: 28, liveSteamMinDb: 55 } },
        profile: { quietMaxDb: 22, liveSteamMinDb: 50 },
        site: { liveSteamMinDb: 58 },
      },
    });
    const b = resolveBands('thermodynamic_disc', p.bands);
    expect(b).toMatchObject({ quietMaxDb: 22, liveSteamMinDb: 58 });
    expect(b.source).toEqual({ quietMaxDb: 'instrument_profile', liveSteamMinDb: 'site_override' });
    // Other types keep their own default under the same profile and site.
    expect(resolveBands('inverted_bucket', resolveParams({ bands: { site: { quietMaxDb: 20 } } }).bands).quietMaxDb).toBe(20);
  });

  it('refuses a quiet band that reaches into the live-steam band', () => {
    expect(() => resolveBands(null, resolveParams({ bands: { site: { quietMaxDb: 60 } } }).bands)).toThrow(RangeError);
  });

  it('shares of test time, edges inclusive as the brief writes them (≤ 25, ≥ 52)', () => {
    const level = Float32Array.from([10, 25, 25.5, 40, 51.9, 52, 70, 80, 20, 30]);
    const s = bandShares(level, regularTimebase(10), { quietMaxDb: 25, liveSteamMinDb: 52 });
    expect(s.quiet).toBeCloseTo(0.3, 12);
    expect(s.condensate).toBeCloseTo(0.4, 12);
    expect(s.liveSteam).toBeCloseTo(0.3, 12);
  });

  it('an irregular clock weights each reading by its share of the time', () => {
    // Readings at 0, 1, 3 s: cells 1, 1.5 and 2 s long (test 4.5 s).
    const s = bandShares(Float32Array.from([10, 40, 60]), irregularTimebase(Float64Array.from([0, 1, 3])), {
      quietMaxDb: 25,
      liveSteamMinDb: 52,
    });
    expect(s.quiet).toBeCloseTo(1 / 4.5, 12);
    expect(s.condensate).toBeCloseTo(1.5 / 4.5, 12);
    expect(s.liveSteam).toBeCloseTo(2 / 4.5, 12);
  });
});

describe('temperature', () => {
  const p = resolveParams();
  it('subcooling against Tsat at 10 barg (184.12 °C, IF97 [computed])', () => {
    const t = assessTemperature(170, 10, 'inverted_bucket', p);
    expect(t.tsatC!).toBeCloseTo(184.12, 2);
    expect(t.subcoolingK!).toBeCloseTo(14.12, 2);
    expect(t.allowanceK).toBe(10);
    expect(t.beyondAllowance).toBe(true);
    expect(t.cold).toBe(false);
  });
  it.each([
    ['thermostatic_bimetallic', 45],
    ['thermostatic_balanced_pressure', 25],
    ['thermodynamic_disc', 10],
    ['float_thermostatic', 10],
    [null, 45],
  ] as const)('allowance for %s: %d K (surface loss 10 K + design)', (type, k) => {
    expect(assessTemperature(150, 5, type, p).allowanceK).toBe(k);
  });
  it('cold exactly when the surface is nearer ambient than saturation', () => {
    // 10 barg: Tsat 184.12 °C, ambient 20 °C, midpoint 102.06 °C.
    expect(assessTemperature(101, 10, 'inverted_bucket', p).cold).toBe(true);
    expect(assessTemperature(103, 10, 'inverted_bucket', p).cold).toBe(false);
    expect(assessTemperature(101, 10, 'inverted_bucket', resolveParams({ temperature: { ambientC: 0 } })).cold).toBe(false);
  });
  it('without a surface reading or a line pressure nothing is judged', () => {
    const noSurface = assessTemperature(null, 10, 'inverted_bucket', p);
    expect(noSurface).toMatchObject({ cold: null, beyondAllowance: null, subcoolingK: null });
    expect(noSurface.tsatC!).toBeCloseTo(184.12, 2);
    expect(assessTemperature(150, null, 'inverted_bucket', p)).toMatchObject({ cold: null, beyondAllowance: null, tsatC: null });
  });
});

describe('reference check', () => {
  it('difference and the 6 dB margin', () => {
    expect(checkReference(48, 40, 6)).toMatchObject({ available: true, differenceDb: 8, clearlyLouder: true });
    expect(checkReference(48, 43, 6)).toMatchObject({ differenceDb: 5, clearlyLouder: false });
    expect(checkReference(48, 42, 6).clearlyLouder).toBe(true);
  });
  it('no reference test: not available, nothing judged', () => {
    expect(checkReference(48, null, 6)).toMatchObject({ available: false, clearlyLouder: null, differenceDb: null });
  });
});

// Parameters: documented defaults (BRIEF §4a), overrides, validation.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PARAMS, resolveParams } from '@/lib/analysis/defaults';

describe('resolveParams', () => {
  it('the defaults of BRIEF §4a', () => {
    const p = resolveParams();
    expect(p.intervals).toMatchObject({ openAboveBaselineDb: 8, closeAboveBaselineDb: 4, minDwellS: 0.2 });
    expect(p.baseline.quantile).toBe(0.1);
    expect(p.reference.marginDb).toBe(6);
    expect(p.temperature).toMatchObject({ ambientC: 20, surfaceLossAllowanceK: 10 });
    expect(p.temperature.designSubcoolingK).toMatchObject({ thermostatic_bimetallic: 35, thermostatic_balanced_pressure: 15 });
    expect(p.loss).toMatchObject({ dischargeCoefficient: 0.6, operatingHoursPerYear: 8000 });
    expect(p.loss.severity).toEqual({ blow_through: 1, leaking: 0.25, rapid_cycling: 0.2 });
    expect(p.verdict).toMatchObject({ blowingLiveSteamShare: 0.8, discRapidCyclesPerMin: 60, bucketMinCyclePeriodS: 5, minContinuousTestS: 20 });
  });

  it('merges overrides section by section and never touches the defaults', () => {
    const p = resolveParams({ intervals: { openAboveBaselineDb: 10 }, loss: { defaultOrificeByDn: [{ maxDn: 50, orificeMm: 5 }] } });
    expect(p.intervals.openAboveBaselineDb).toBe(10);
    expect(p.intervals.closeAboveBaselineDb).toBe(4);
    expect(p.loss.defaultOrificeByDn).toEqual([{ maxDn: 50, orificeMm: 5 }]);
    expect(DEFAULT_PARAMS.intervals.openAboveBaselineDb).toBe(8);
    expect(DEFAULT_PARAMS.loss.defaultOrificeByDn).toHaveLength(3);
  });

  it('a resolved object resolves to itself (a stored parameter set re-runs unchanged)', () => {
    const p = resolveParams({ reference: { marginDb: 4 }, bands: { site: { quietMaxDb: 22 } } });
    expect(resolveParams(JSON.parse(JSON.stringify(p)))).toEqual(p);
  });

  it.each([
    [{ intervals: { openAboveBaselineDb: 3 } }, /open limit/],
    [{ loss: { dischargeCoefficient: 2 } }, /dischargeCoefficient/],
    [{ cost: { boilerEfficiency: 0 } }, /boilerEfficiency/],
    [{ smoothing: { medianWindowSamples: 4 } }, /odd/],
    [{ loss: { severity: { leaking: 1.5 } } }, /severity\.leaking/],
  ])('refuses %j', (overrides, message) => {
    expect(() => resolveParams(overrides)).toThrow(message);
  });
});

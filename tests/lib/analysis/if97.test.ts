// IAPWS-IF97 against the verification tables of IAPWS R7-97 (2007 revision), as
// transcribed in shared/references/trade-references.md §2 [read]; and saturated
// steam at gauge pressures against the table computed there (§2.3) and the
// Ohio University saturated-steam table cross-check [read].
import { describe, expect, it } from 'vitest';
import { region1EnthalpyKjPerKg } from '@/lib/analysis/if97-region1';
import { region2EnthalpyKjPerKg } from '@/lib/analysis/if97-region2';
import { saturationPressureMpa, saturationTemperatureK } from '@/lib/analysis/if97-region4';
import { saturatedSteamAtGauge } from '@/lib/analysis/saturated-steam';
import { celsiusToFahrenheit, kjPerKgToBtuPerLb, psiToBar } from '@/lib/analysis/units';

// The tables print 9 significant digits; agreement "to the printed digits" means
// the computed value rounds to the printed one.
function toPrinted(value: number, digits = 9): number {
  return Number(value.toPrecision(digits));
}

describe('IF97 region 4', () => {
  it.each([
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ])('Table 35: psat(%d K) = %s MPa', (t, p) => {
    expect(toPrinted(saturationPressureMpa(t))).toBe(p);
  });

  it.each([
    [0.1, 0.372755919e3],
    [1, 0.453035632e3],
    [10, 0.584149488e3],
  ])('Table 36: Tsat(%s MPa) = %s K', (p, t) => {
    expect(toPrinted(saturationTemperatureK(p))).toBe(t);
  });

  it('Eq. 30 and Eq. 31 invert each other along the line used by steam traps (0.5–40 barg)', () => {
    for (let p = 0.15; p <= 4.1; p += 0.05) {
      expect(saturationPressureMpa(saturationTemperatureK(p)) / p - 1).toBeLessThan(1e-8);
    }
  });

  it('refuses temperatures and pressures outside the saturation line', () => {
    expect(() => saturationPressureMpa(250)).toThrow(RangeError);
    expect(() => saturationPressureMpa(700)).toThrow(RangeError);
    expect(() => saturationTemperatureK(23)).toThrow(RangeError);
    expect(() => saturationTemperatureK(0)).toThrow(RangeError);
  });
});

describe('IF97 regions 1 and 2: enthalpy', () => {
  it.each([
    [300, 3, 0.115331273e3],
    [300, 80, 0.184142828e3],
    [500, 3, 0.975542239e3],
  ])('Table 5: h(%d K, %s MPa) = %s kJ/kg', (t, p, h) => {
    expect(toPrinted(region1EnthalpyKjPerKg(t, p))).toBe(h);
  });

  it.each([
    [300, 0.0035, 0.254991145e4],
    [700, 0.0035, 0.333568375e4],
    [700, 30, 0.263149474e4],
  ])('Table 15: h(%d K, %s MPa) = %s kJ/kg', (t, p, h) => {
    expect(toPrinted(region2EnthalpyKjPerKg(t, p))).toBe(h);
  });

  it('refuses states outside each region', () => {
    expect(() => region1EnthalpyKjPerKg(400, 0.1)).toThrow(RangeError); // steam at 1 bar, not liquid
    expect(() => region2EnthalpyKjPerKg(400, 1)).toThrow(RangeError); // liquid at 10 bar, not steam
  });
});

describe('saturated steam at gauge pressure', () => {
  // trade-references.md §2.3, SI table [computed with IF97, atmosphere 101.325 kPa].
  it.each([
    [0, 99.97, 418.99, 2256.54, 2675.53],
    [1, 120.42, 505.57, 2200.97, 2706.54],
    [2, 133.68, 562.1, 2163.0, 2725.09],
    [3, 143.73, 605.24, 2132.97, 2738.21],
    [5, 158.92, 670.88, 2085.36, 2756.23],
    [7, 170.48, 721.32, 2047.05, 2768.37],
    [10, 184.12, 781.43, 1999.28, 2780.71],
    [15, 201.42, 858.79, 1934.11, 2792.9],
    [20, 214.9, 920.14, 1879.23, 2799.37],
  ])('%d barg: Tsat %s °C, hf %s, hfg %s, hg %s kJ/kg', (barg, tsat, hf, hfg, hg) => {
    const s = saturatedSteamAtGauge(barg, 101.325);
    expect(s.tsatC).toBeCloseTo(tsat, 2);
    expect(s.hfKjPerKg).toBeCloseTo(hf, 2);
    expect(s.hfgKjPerKg).toBeCloseTo(hfg, 2);
    expect(s.hgKjPerKg).toBeCloseTo(hg, 2);
  });

  // trade-references.md §2.3, imperial table [computed]; 1 Btu/lb = 2.326 kJ/kg.
  it.each([
    [0, 212.0, 180.1, 970.1, 1150.3],
    [15, 249.7, 218.3, 945.6, 1163.9],
    [50, 297.7, 267.3, 911.9, 1179.3],
    [100, 337.9, 309.1, 880.9, 1190.0],
    [150, 365.9, 338.6, 857.4, 1196.0],
    [300, 421.8, 398.8, 804.9, 1203.8],
  ])('%d psig: Tsat %s °F, hf %s, hfg %s, hg %s Btu/lb', (psig, tsatF, hf, hfg, hg) => {
    const s = saturatedSteamAtGauge(psiToBar(psig), 101.325);
    expect(celsiusToFahrenheit(s.tsatC)).toBeCloseTo(tsatF, 1);
    expect(kjPerKgToBtuPerLb(s.hfKjPerKg)).toBeCloseTo(hf, 1);
    expect(kjPerKgToBtuPerLb(s.hfgKjPerKg)).toBeCloseTo(hfg, 1);
    expect(kjPerKgToBtuPerLb(s.hgKjPerKg)).toBeCloseTo(hg, 1);
  });

  // Ohio University saturated-steam temperature table [read], printed to 0.1 kJ/kg.
  it.each([
    [50, 209.3, 2382.0, 2591.3],
    [90, 377.0, 2282.5, 2659.5],
  ])('%d °C: hf %s, hfg %s, hg %s kJ/kg (university table, to its 0.1 kJ/kg)', (tC, hf, hfg, hg) => {
    const tK = tC + 273.15;
    const p = saturationPressureMpa(tK);
    const hfOurs = region1EnthalpyKjPerKg(tK, p);
    const hgOurs = region2EnthalpyKjPerKg(tK, p);
    expect(Math.abs(hfOurs - hf)).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(Math.abs(hgOurs - hf - hfg)).toBeLessThanOrEqual(0.1);
    expect(Math.abs(hgOurs - hg)).toBeLessThanOrEqual(0.05 + 1e-9);
  });
});

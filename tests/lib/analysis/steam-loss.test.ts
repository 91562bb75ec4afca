// Steam loss by Napier's rule with an explicit discharge coefficient.
// Sources: shared/references/trade-references.md §1 — the 24.24 practical form
// [read: Manczyk article], DOE Steam Tip Sheet #1 "Inspect and Repair Steam Traps"
// (table and worked example) [read cells marked], AM0017 severity factors [secondary].
import { describe, expect, it } from 'vitest';
import { resolveParams } from '@/lib/analysis/defaults';
import { costOfLoss } from '@/lib/analysis/energy-cost';
import { NAPIER_CONVENTIONS, defaultOrifice, estimateSteamLoss, napierFlowKgPerHour } from '@/lib/analysis/steam-loss';
import { barToPsi, inToMm, kgToLb, lbToKg, psiToBar } from '@/lib/analysis/units';

const PSI_ATM = 14.696; // standard atmosphere in psi, as the sources use
const kpaAbsFromPsig = (psig: number) => ((psig + PSI_ATM) * 6894.757293168) / 1000;
const lbPerHour = (psig: number, inches: number, cd: number) => kgToLb(napierFlowKgPerHour(kpaAbsFromPsig(psig), inToMm(inches), cd));

describe('Napier, 24.24 practical form (Cd 0.60)', () => {
  it('100 psig, 1/8 in → 43.4 lb/h (24.24 × 114.696 × 1/64 = 43.44 [computed])', () => {
    expect(lbPerHour(100, 1 / 8, 0.6)).toBeCloseTo(43.44, 1);
  });
  it('5 psig, 3/16 in → 16.78 lb/h (Manczyk example [read])', () => {
    expect(lbPerHour(5, 3 / 16, 0.6)).toBeCloseTo(16.78, 1);
  });
  it('the constant: Cd 0.60 × Napier = 24.24 lb/h per psia·in² to 4 digits', () => {
    expect(lbPerHour(0, 1, 0.6) / PSI_ATM).toBeCloseTo(24.24, 1);
  });
  it('SI form: 10 barg, 3 mm → 24.5 kg/h (trade-references §1.1 [computed])', () => {
    expect(napierFlowKgPerHour(1101.325, 3, 0.6)).toBeCloseTo(24.5, 1);
  });
});

describe('DOE Steam Tip Sheet #1 convention (Cd 0.7292, implied by its table)', () => {
  const cd = NAPIER_CONVENTIONS.doe_tip_sheet_1.dischargeCoefficient;
  it('150 psig, 1/8 in → 75.8 lb/h [read]', () => {
    expect(lbPerHour(150, 1 / 8, cd)).toBeCloseTo(75.8, 1);
  });
  // The other cells read from the sheet; the table's own rounding spreads the implied
  // constant over 29.31–29.84 lb/h per psia·in² (trade-references §1.3), so ±2 %.
  it.each([
    [15, 1 / 32, 0.85],
    [100, 1 / 32, 3.3],
    [150, 1 / 32, 4.8],
    [15, 1 / 16, 3.4],
    [100, 1 / 16, 13.2],
  ])('%d psig, %d in → %d lb/h [read], within the table rounding', (psig, d, printed) => {
    expect(Math.abs(lbPerHour(psig, d, cd) / printed - 1)).toBeLessThan(0.02);
  });
  it('worked example: 75.8 lb/h × 8,760 h × $4.50 per 1,000 lb ≈ $2,988/yr [read]', () => {
    const params = resolveParams({
      loss: { dischargeCoefficient: cd, convention: NAPIER_CONVENTIONS.doe_tip_sheet_1.label, operatingHoursPerYear: 8760 },
      // $4.50 per 1,000 lb as a price per tonne: 1,000 lb = 0.45359237 t.
      cost: { steamPricePerTonne: 4.5 / 0.45359237, currency: 'USD' },
    });
    const loss = estimateSteamLoss({ pressureBarg: psiToBar(150), orificeMm: inToMm(1 / 8), sizeDn: null, lossMode: 'blow_through' }, params);
    expect(loss.convention).toMatch(/DOE Steam Tip Sheet #1/);
    expect(loss.dischargeCoefficient).toBe(cd);
    const cost = costOfLoss(loss.tonnesPerYear, loss.pressureBarg, params);
    expect(cost.costBasis).toBe('steam_price');
    expect(cost.costPerYear!).toBeGreaterThan(2988 - 5);
    expect(cost.costPerYear!).toBeLessThan(2988 + 5);
  });
  it('the two conventions differ by the 21.5 % of trade-references §1.3 (62.4 against 75.8 lb/h)', () => {
    expect(lbPerHour(150, 1 / 8, 0.6)).toBeCloseTo(62.4, 1);
    expect(lbPerHour(150, 1 / 8, cd) / lbPerHour(150, 1 / 8, 0.6)).toBeCloseTo(1.215, 2);
  });
});

describe('estimateSteamLoss', () => {
  const params = resolveParams();

  it('defaults: Cd 0.60 with its convention named, severity separate from the coefficient', () => {
    const full = estimateSteamLoss({ pressureBarg: 10, orificeMm: 3, sizeDn: 15, lossMode: 'blow_through' }, params);
    const leak = estimateSteamLoss({ pressureBarg: 10, orificeMm: 3, sizeDn: 15, lossMode: 'leaking' }, params);
    const rapid = estimateSteamLoss({ pressureBarg: 10, orificeMm: 3, sizeDn: 15, lossMode: 'rapid_cycling' }, params);
    expect(full.dischargeCoefficient).toBe(0.6);
    expect(full.convention).toMatch(/24\.24/);
    expect(full.orificeSource).toBe('register');
    expect(full.kgPerHour).toBeCloseTo(24.5, 1);
    // AM0017 loss fractions [secondary]: blow-through 1.0, leaking 0.25, rapid cycling 0.20.
    expect(leak.kgPerHour / full.kgPerHour).toBeCloseTo(0.25, 12);
    expect(rapid.kgPerHour / full.kgPerHour).toBeCloseTo(0.2, 12);
    expect(leak.fullOrificeKgPerHour).toBe(full.fullOrificeKgPerHour);
  });

  it('tonnes per year over the operating hours (BRIEF §3 default 8,000 h)', () => {
    const loss = estimateSteamLoss({ pressureBarg: 10, orificeMm: 3, sizeDn: null, lossMode: 'blow_through' }, params);
    expect(loss.operatingHoursPerYear).toBe(8000);
    expect(loss.tonnesPerYear).toBeCloseTo((loss.kgPerHour * 8000) / 1000, 9);
  });

  // Our defaults, from memory (BRIEF §4a): DN15 3.2, DN20 4.8, DN25 6.4, larger 9.5 mm.
  it.each([
    [10, 3.2],
    [15, 3.2],
    [20, 4.8],
    [25, 6.4],
    [32, 9.5],
    [50, 9.5],
  ])('default orifice for DN%d: %d mm', (dn, mm) => {
    expect(defaultOrifice(dn, params.loss)).toEqual({ orificeMm: mm, source: 'default_by_size' });
    expect(estimateSteamLoss({ pressureBarg: 5, orificeMm: null, sizeDn: dn, lossMode: 'leaking' }, params).orificeMm).toBe(mm);
  });

  it('unknown size: the smallest default, and the source says so', () => {
    expect(defaultOrifice(null, params.loss)).toEqual({ orificeMm: 3.2, source: 'default_unknown_size' });
  });

  it('refuses a negative gauge pressure', () => {
    expect(() => estimateSteamLoss({ pressureBarg: -1, orificeMm: 3, sizeDn: null, lossMode: 'leaking' }, params)).toThrow(RangeError);
  });

  it('lb/h and kg/h agree through the exact pound (0.45359237 kg)', () => {
    expect(lbToKg(kgToLb(12.5))).toBeCloseTo(12.5, 12);
    expect(barToPsi(psiToBar(150))).toBeCloseTo(150, 12);
  });
});

// Energy, cost and CO2 of lost steam.
// Sources: DOE Steam Tip Sheet #15 "Benchmark the Fuel Cost of Steam Generation",
// Table 1 [read] and Table 2 [read]; EPA 40 CFR Part 98 Subpart C Table C-1 [read];
// worked figures of trade-references §3.3 and §4 [computed / read as marked].
import { describe, expect, it } from 'vitest';
import { EPA_TABLE_C1_KG_PER_MMBTU, epaEmissionFactor, resolveParams } from '@/lib/analysis/defaults';
import { costOfLoss, fuelCostPerTonneSteam, steamEnergy } from '@/lib/analysis/energy-cost';
import { btuPerLbToKjPerKg, fahrenheitToCelsius, kjPerKgToBtuPerLb, psiToBar } from '@/lib/analysis/units';

const ATM = 101.325;
// US figures per 1,000 lb of steam: 1,000 lb = 0.45359237 t.
const TONNES_PER_KLB = 0.45359237;

describe('DOE Steam Tip Sheet #15, Table 1: energy to make 1 lb of saturated steam (Btu/lb)', () => {
  it.each([
    [150, 50, 1178],
    [150, 100, 1128],
    [150, 150, 1078],
    [150, 200, 1028],
    [150, 250, 977],
    [450, 50, 1187],
    [450, 250, 986],
    [600, 50, 1184],
    [600, 250, 984],
  ])('%d psig from %d °F feedwater: %d Btu/lb, within 2 Btu/lb', (psig, feedF, btu) => {
    const e = steamEnergy(psiToBar(psig), fahrenheitToCelsius(feedF), ATM);
    expect(Math.abs(kjPerKgToBtuPerLb(e.energyKjPerKg) - btu)).toBeLessThanOrEqual(2);
  });

  it('feedwater at or above saturation is refused', () => {
    expect(() => steamEnergy(1, 130, ATM)).toThrow(RangeError);
  });
});

describe('EPA 40 CFR 98 Table C-1 CO2 factors (kg CO2/mmBtu, HHV)', () => {
  it.each([
    ['natural_gas', 53.06, 50.29],
    ['distillate_fuel_oil_no2', 73.96, 70.1],
    ['bituminous_coal', 93.28, 88.41],
  ] as const)('%s: %d kg/mmBtu [read] = %d kg/GJ [computed]', (fuel, perMmbtu, perGj) => {
    expect(EPA_TABLE_C1_KG_PER_MMBTU[fuel]).toBe(perMmbtu);
    const factor = epaEmissionFactor(fuel);
    expect(factor.kgCo2PerGj).toBeCloseTo(perGj, 2);
    expect(factor.source).toMatch(/40 CFR Part 98.*Table C-1/);
    expect(factor.year).toBe(2016);
  });
});

describe('cost and CO2 of a loss', () => {
  it('fuel cost per 1,000 lb: 1,073 Btu/lb, $8.00/MMBtu, 81 % → $10.60 (utility-page example [read])', () => {
    const perGj = 8 / 1.05505585262;
    const perTonne = fuelCostPerTonneSteam(btuPerLbToKjPerKg(1073), perGj, 0.81);
    expect(perTonne * TONNES_PER_KLB).toBeCloseTo(10.6, 2);
  });

  it('150 psig, 200 °F feedwater, gas at $8.00/MMBtu, 85.7 % → $9.60 per 1,000 lb and 63.6 kg CO2 per 1,000 lb [computed, trade-references §3.3, §4]', () => {
    const params = resolveParams({
      cost: { feedwaterC: fahrenheitToCelsius(200), boilerEfficiency: 0.857, fuelPricePerGj: 8 / 1.05505585262, currency: 'USD' },
    });
    const cost = costOfLoss(TONNES_PER_KLB, psiToBar(150), params); // one thousand pounds
    expect(cost.costBasis).toBe('fuel_price');
    expect(cost.costPerYear!).toBeCloseTo(9.6, 1);
    expect(cost.co2TonnesPerYear * 1000).toBeCloseTo(63.6, 0);
    expect(cost.emissionFactor.fuel).toBe('natural_gas');
  });

  it('10 barg from 105 °C feedwater at 85.7 %: 2.730 GJ fuel and 137.3 kg CO2 per tonne of steam [computed, trade-references §3.3]', () => {
    const cost = costOfLoss(1, 10, resolveParams());
    expect(cost.energyKjPerKg).toBeCloseTo(2339.7, 0);
    expect(cost.fuelEnergyGjPerYear).toBeCloseTo(2.73, 2);
    expect(cost.co2TonnesPerYear * 1000).toBeCloseTo(137.3, 0);
    // No price set: no cost, but energy and CO2 are still given.
    expect(cost.costPerYear).toBeNull();
    expect(cost.costBasis).toBeNull();
  });

  it('a steam price wins over a fuel price', () => {
    const params = resolveParams({ cost: { steamPricePerTonne: 30, fuelPricePerGj: 10, currency: 'EUR' } });
    const cost = costOfLoss(100, 8, params);
    expect(cost.costBasis).toBe('steam_price');
    expect(cost.costPerYear).toBeCloseTo(3000, 9);
    expect(cost.currency).toBe('EUR');
  });
});

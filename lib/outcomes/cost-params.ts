// A site's cost settings as the analysis's parameter overrides (lib/analysis/defaults.ts), so
// every loss, cost and CO2 figure is computed by the same functions with the site's numbers.
import type { ParamOverrides } from '@/lib/analysis/defaults';

export type CostSettings = {
  operatingHoursPerYear: number;
  steamPricePerTonne: number | null;
  fuelPricePerGj: number | null;
  boilerEfficiency: number;
  feedwaterC: number;
  fuel: string;
  co2KgPerGj: number;
  co2FactorSource: string;
  co2FactorYear: number;
  currency: string;
};

export function costOverrides(s: CostSettings): ParamOverrides {
  return {
    loss: { operatingHoursPerYear: s.operatingHoursPerYear },
    cost: {
      steamPricePerTonne: s.steamPricePerTonne,
      fuelPricePerGj: s.fuelPricePerGj,
      boilerEfficiency: s.boilerEfficiency,
      feedwaterC: s.feedwaterC,
      currency: s.currency,
      emissionFactor: { fuel: s.fuel, kgCo2PerGj: s.co2KgPerGj, source: s.co2FactorSource, year: s.co2FactorYear },
    },
  };
}

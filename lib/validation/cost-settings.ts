import { z } from 'zod';

export const FUELS = ['natural_gas', 'distillate_fuel_oil_no2', 'bituminous_coal', 'other'] as const;

export const costSettingsSchema = z.object({
  operatingHoursPerYear: z.number().min(0).max(8784, 'A year has at most 8,784 hours.'),
  steamPricePerTonne: z.number().min(0).nullable(),
  fuelPricePerGj: z.number().min(0).nullable(),
  boilerEfficiency: z.number().min(0.05, 'Boiler efficiency is a fraction, e.g. 0.85.').max(1),
  feedwaterC: z.number().min(0).max(250),
  fuel: z.enum(FUELS),
  co2KgPerGj: z.number().min(0).max(200),
  co2FactorSource: z.string().trim().min(3, 'Name where the CO2 factor comes from.').max(300),
  co2FactorYear: z.number().int().min(1990).max(2100),
});
export type CostSettingsInput = z.output<typeof costSettingsSchema>;

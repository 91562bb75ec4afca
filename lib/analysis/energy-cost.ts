// Energy, cost and CO2 of lost steam (BRIEF §4 item 8).
//  - Energy to make the steam: saturated steam at line pressure (IF97 region 2 on the
//    saturation line) minus feedwater (IF97 region 1 at the feedwater temperature and
//    line pressure, as pumped into the boiler), the method of DOE Steam Tip Sheet #15
//    Table 1 ("steam enthalpy minus feedwater enthalpy").
//  - Fuel energy = steam energy ÷ boiler efficiency (same sheet).
//  - Cost: a steam price per tonne when the site has one, else fuel price per GJ × fuel energy.
//  - CO2 = fuel energy × the fuel's emission factor; the factor's source and year travel with the figure.

import type { AnalysisParams, EmissionFactor } from './defaults';
import { region1EnthalpyKjPerKg } from './if97-region1';
import { saturationPressureMpa } from './if97-region4';
import { KELVIN_OFFSET, saturatedSteamAtGauge } from './saturated-steam';

export interface SteamEnergy {
  steamEnthalpyKjPerKg: number;
  feedwaterEnthalpyKjPerKg: number;
  /** Energy added per kg of steam, kJ/kg. */
  energyKjPerKg: number;
}

export function steamEnergy(pressureBarg: number, feedwaterC: number, atmosphericKpa: number): SteamEnergy {
  const steam = saturatedSteamAtGauge(pressureBarg, atmosphericKpa);
  if (!(feedwaterC < steam.tsatC)) {
    throw new RangeError(`feedwater at ${feedwaterC} °C is not below saturation (${steam.tsatC.toFixed(1)} °C) at ${pressureBarg} barg`);
  }
  const tK = feedwaterC + KELVIN_OFFSET;
  // Region 1 needs p ≥ psat(T); the line pressure always is, for feedwater below saturation.
  const pMpa = Math.max(steam.absoluteMpa, saturationPressureMpa(tK));
  const feed = region1EnthalpyKjPerKg(tK, pMpa);
  return {
    steamEnthalpyKjPerKg: steam.hgKjPerKg,
    feedwaterEnthalpyKjPerKg: feed,
    energyKjPerKg: steam.hgKjPerKg - feed,
  };
}

/** Fuel cost of one tonne of steam: price per GJ of fuel × energy per kg ÷ efficiency (DOE Steam Tip Sheet #15, in SI). */
export function fuelCostPerTonneSteam(energyKjPerKg: number, fuelPricePerGj: number, boilerEfficiency: number): number {
  return (fuelPricePerGj * energyKjPerKg) / (1000 * boilerEfficiency);
}

export interface LossCost {
  costBasis: 'steam_price' | 'fuel_price' | null;
  currency: string | null;
  /** Cost per year in the site currency; null when neither a steam nor a fuel price is set. */
  costPerYear: number | null;
  costPerTonne: number | null;
  feedwaterC: number;
  boilerEfficiency: number;
  energyKjPerKg: number;
  /** Energy carried away by the lost steam, GJ/yr. */
  steamEnergyGjPerYear: number;
  /** Fuel burnt to make it, GJ/yr. */
  fuelEnergyGjPerYear: number;
  co2TonnesPerYear: number;
  emissionFactor: EmissionFactor;
}

export function costOfLoss(tonnesPerYear: number, pressureBarg: number, params: AnalysisParams): LossCost {
  const c = params.cost;
  const energy = steamEnergy(pressureBarg, c.feedwaterC, params.pressure.atmosphericKpa);
  // 1 t × 1 kJ/kg = 1000 kJ = 0.001 GJ.
  const steamEnergyGjPerYear = (tonnesPerYear * energy.energyKjPerKg) / 1000;
  const fuelEnergyGjPerYear = steamEnergyGjPerYear / c.boilerEfficiency;
  let costBasis: LossCost['costBasis'] = null;
  let costPerTonne: number | null = null;
  if (c.steamPricePerTonne !== null && Number.isFinite(c.steamPricePerTonne)) {
    costBasis = 'steam_price';
    costPerTonne = c.steamPricePerTonne;
  } else if (c.fuelPricePerGj !== null && Number.isFinite(c.fuelPricePerGj)) {
    costBasis = 'fuel_price';
    costPerTonne = fuelCostPerTonneSteam(energy.energyKjPerKg, c.fuelPricePerGj, c.boilerEfficiency);
  }
  return {
    costBasis,
    currency: c.currency,
    costPerYear: costPerTonne === null ? null : costPerTonne * tonnesPerYear,
    costPerTonne,
    feedwaterC: c.feedwaterC,
    boilerEfficiency: c.boilerEfficiency,
    energyKjPerKg: energy.energyKjPerKg,
    steamEnergyGjPerYear,
    fuelEnergyGjPerYear,
    co2TonnesPerYear: (fuelEnergyGjPerYear * c.emissionFactor.kgCo2PerGj) / 1000,
    emissionFactor: c.emissionFactor,
  };
}

// Saturated water and steam at a line's gauge pressure, from IAPWS-IF97:
// Tsat from Eq. 31, hf from region 1 at (Tsat, p), hg from region 2 at (Tsat, p),
// hfg = hg − hf. The same method produced the table in
// shared/references/trade-references.md §2.3, which the tests compare against.

import { region1EnthalpyKjPerKg } from './if97-region1';
import { region2EnthalpyKjPerKg } from './if97-region2';
import { saturationTemperatureK } from './if97-region4';

export const KELVIN_OFFSET = 273.15;

export interface SaturatedSteam {
  gaugeBar: number;
  absoluteMpa: number;
  tsatC: number;
  hfKjPerKg: number;
  hgKjPerKg: number;
  hfgKjPerKg: number;
}

export function absolutePressureMpa(gaugeBar: number, atmosphericKpa: number): number {
  return gaugeBar * 0.1 + atmosphericKpa / 1000;
}

export function saturationTemperatureAtGaugeC(gaugeBar: number, atmosphericKpa: number): number {
  return saturationTemperatureK(absolutePressureMpa(gaugeBar, atmosphericKpa)) - KELVIN_OFFSET;
}

export function saturatedSteamAtGauge(gaugeBar: number, atmosphericKpa: number): SaturatedSteam {
  const p = absolutePressureMpa(gaugeBar, atmosphericKpa);
  const tsatK = saturationTemperatureK(p);
  const hf = region1EnthalpyKjPerKg(tsatK, p);
  const hg = region2EnthalpyKjPerKg(tsatK, p);
  return {
    gaugeBar,
    absoluteMpa: p,
    tsatC: tsatK - KELVIN_OFFSET,
    hfKjPerKg: hf,
    hgKjPerKg: hg,
    hfgKjPerKg: hg - hf,
  };
}

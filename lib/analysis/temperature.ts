// Surface temperature against the line's saturation temperature (BRIEF §4, §4a).
//  - subcooling ΔT = Tsat − surface;
//  - allowance = surface-loss allowance (10 K: a contact reading on the outside of a
//    hot body reads below the fluid) + the type's design subcooling (bimetallic 35 K,
//    balanced pressure 15 K; thermostatic traps hold condensate back until it cools);
//  - cold: the surface is nearer ambient than saturation.

import type { AnalysisParams } from './defaults';
import { saturationTemperatureAtGaugeC } from './saturated-steam';
import type { TrapType } from './trap-types';

export interface TemperatureAssessment {
  /** Surface temperature (the median of the test's finite readings), °C; null when the test has none. */
  surfaceC: number | null;
  ambientC: number;
  pressureBarg: number | null;
  tsatC: number | null;
  subcoolingK: number | null;
  allowanceK: number;
  /** True when subcooling exceeds the allowance; null when it cannot be judged. */
  beyondAllowance: boolean | null;
  /** Nearer ambient than saturation; null when it cannot be judged. */
  cold: boolean | null;
}

export function designAllowanceK(trapType: TrapType | null, p: AnalysisParams['temperature']): number {
  return trapType ? p.designSubcoolingK[trapType] : p.unknownTypeDesignSubcoolingK;
}

export function assessTemperature(
  surfaceC: number | null,
  pressureBarg: number | null,
  trapType: TrapType | null,
  params: AnalysisParams,
): TemperatureAssessment {
  const p = params.temperature;
  const allowanceK = p.surfaceLossAllowanceK + designAllowanceK(trapType, p);
  const tsatC =
    pressureBarg === null || !Number.isFinite(pressureBarg)
      ? null
      : saturationTemperatureAtGaugeC(pressureBarg, params.pressure.atmosphericKpa);
  if (surfaceC === null || tsatC === null) {
    return { surfaceC, ambientC: p.ambientC, pressureBarg, tsatC, subcoolingK: null, allowanceK, beyondAllowance: null, cold: null };
  }
  const subcoolingK = tsatC - surfaceC;
  return {
    surfaceC,
    ambientC: p.ambientC,
    pressureBarg,
    tsatC,
    subcoolingK,
    allowanceK,
    beyondAllowance: subcoolingK > allowanceK,
    cold: Math.abs(surfaceC - p.ambientC) < Math.abs(tsatC - surfaceC),
  };
}

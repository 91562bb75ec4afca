// Surface temperature against the line's saturation temperature (BRIEF §4, §4a).
//  - subcooling ΔT = Tsat − surface;
//  - allowance = surface-loss allowance (10 K: a contact reading on the outside of a
//    hot body reads below the fluid) + the type's design subcooling (bimetallic 35 K,
//    balanced pressure 15 K; thermostatic traps hold condensate back until it cools);
//  - cold: the surface is nearer ambient than saturation.

import type { AnalysisParams } from './defaults';
import { quantiles } from './quantiles';
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

export interface TemperatureSummary {
  /** Finite readings; a meter may leave gaps (NaN) in the temperature column. */
  count: number;
  meanC: number;
  medianC: number;
  minC: number;
  maxC: number;
}

/**
 * Summary of the finite surface readings; null when there are none. Count, mean, min
 * and max use every reading; the median uses at most ~65,000 evenly spaced readings,
 * plenty for a surface temperature that changes over seconds, not samples.
 */
export function summariseTemperature(values: ArrayLike<number> | null | undefined): TemperatureSummary | null {
  if (!values || values.length === 0) return null;
  const n = values.length;
  let count = 0;
  let sum = 0;
  let minC = Infinity;
  let maxC = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    if (!(v - v === 0)) continue; // NaN and ±Infinity are gaps
    count++;
    sum += v;
    if (v < minC) minC = v;
    if (v > maxC) maxC = v;
  }
  if (count === 0) return null;
  // Temperatures span a few hundred kelvin: a plain sum loses nothing that matters here.
  return { count, meanC: sum / count, medianC: medianOf(values, count, minC, maxC), minC, maxC };
}

/** The median of the finite readings, of at most ~65,000 evenly spaced ones; min and max bound them all. */
function medianOf(values: ArrayLike<number>, finite: number, minC: number, maxC: number): number {
  const n = values.length;
  const step = Math.max(1, Math.floor(n / 65_536));
  // A test's column with no gap, the usual case: its readings as they are.
  if (step === 1 && finite === n) return quantiles(values, [0.5], minC, maxC)[0];
  // The readings' own precision; float32 as they are stored, so the quantiles' passes see one kind of array.
  const Picked = values instanceof Float32Array ? Float32Array : Float64Array;
  const picked = new Picked(Math.ceil(n / step));
  let count = 0;
  for (let i = 0; i < n; i += step) if (Number.isFinite(values[i])) picked[count++] = values[i];
  if (count > 0) return quantiles(picked.subarray(0, count), [0.5], minC, maxC)[0];
  // Sparse readings can all fall between the picks: then take every finite one.
  const finiteOnes = new Picked(finite);
  for (let i = 0; i < n; i++) if (Number.isFinite(values[i])) finiteOnes[count++] = values[i];
  return quantiles(finiteOnes, [0.5], minC, maxC)[0];
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

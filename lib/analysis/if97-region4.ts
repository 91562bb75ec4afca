// IAPWS-IF97 region 4: the saturation line.
// Source: IAPWS R7-97 (2007 revision), "Revised Release on the IAPWS Industrial
// Formulation 1997 for the Thermodynamic Properties of Water and Steam":
// Eq. 30 (saturation pressure), Eq. 31 (saturation temperature), Table 34 (coefficients).
// Checked against Tables 35 and 36 in tests/lib/analysis/if97.test.ts.

// Table 34, n1…n10 (index 0 unused so the names match the release).
const N = [
  0, 0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7,
  0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** Range of Eq. 30: 273.15 K ≤ T ≤ 647.096 K (the critical temperature). */
export const REGION4_T_MIN_K = 273.15;
export const REGION4_T_MAX_K = 647.096;
/** Range of Eq. 31: psat(273.15 K) ≤ p ≤ 22.064 MPa (the critical pressure). */
export const REGION4_P_MIN_MPA = 611.213e-6;
export const REGION4_P_MAX_MPA = 22.064;

/** Saturation pressure in MPa at temperature T in K (IF97 Eq. 30). */
export function saturationPressureMpa(temperatureK: number): number {
  if (!(temperatureK >= REGION4_T_MIN_K && temperatureK <= REGION4_T_MAX_K)) {
    throw new RangeError(`saturation pressure is defined from 273.15 K to 647.096 K, got ${temperatureK} K`);
  }
  const theta = temperatureK + N[9] / (temperatureK - N[10]);
  const A = theta * theta + N[1] * theta + N[2];
  const B = N[3] * theta * theta + N[4] * theta + N[5];
  const C = N[6] * theta * theta + N[7] * theta + N[8];
  return ((2 * C) / (-B + Math.sqrt(B * B - 4 * A * C))) ** 4;
}

/** Saturation temperature in K at pressure p in MPa (IF97 Eq. 31). */
export function saturationTemperatureK(pressureMpa: number): number {
  // A small tolerance below the triple-point pressure: Eq. 31's own lower limit is printed to 6 digits.
  if (!(pressureMpa >= REGION4_P_MIN_MPA * 0.9999 && pressureMpa <= REGION4_P_MAX_MPA)) {
    throw new RangeError(`saturation temperature is defined from 611.213 Pa to 22.064 MPa, got ${pressureMpa} MPa`);
  }
  const beta = pressureMpa ** 0.25;
  const E = beta * beta + N[3] * beta + N[6];
  const F = N[1] * beta * beta + N[4] * beta + N[7];
  const G = N[2] * beta * beta + N[5] * beta + N[8];
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  return (N[10] + D - Math.sqrt((N[10] + D) ** 2 - 4 * (N[9] + N[10] * D))) / 2;
}

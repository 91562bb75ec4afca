// IAPWS-IF97 region 2 (steam, up to the saturation line): specific enthalpy.
// Source: IAPWS R7-97 (2007 revision), Eq. 15–17 (ideal-gas and residual parts of the
// dimensionless Gibbs free energy), Table 10 (ideal-gas coefficients), Table 11
// (residual coefficients), Table 12 (h = R·T·τ·(γ°τ + γʳτ)).
// Checked against Table 15 in tests/lib/analysis/if97.test.ts.

import { IF97_R } from './if97-region1';
import { saturationPressureMpa } from './if97-region4';

// Table 10: J°, n° for i = 1…9.
const J0 = [0, 1, -5, -4, -3, -2, -1, 2, 3];
const n0 = [
  -0.96927686500217e1, 0.10086655968018e2, -0.5608791128302e-2, 0.71452738081455e-1, -0.40710498223928,
  0.14240819171444e1, -0.4383951131945e1, -0.28408632460772, 0.21268463753307e-1,
];

// Table 11: I, J, n for i = 1…43.
const I = [
  1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10, 10, 10, 16, 16, 18, 20, 20,
  20, 21, 22, 23, 24, 24, 24,
];
const J = [
  0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36, 13, 4, 10, 14, 29, 50, 57,
  20, 35, 48, 21, 53, 39, 26, 40, 58,
];
const n = [
  -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1, -0.5032527872793e-1,
  -0.33032641670203e-4, -0.18948987516315e-3, -0.39392777243355e-2, -0.43797295650573e-1, -0.26674547914087e-4,
  0.20481737692309e-7, 0.43870667284435e-6, -0.3227767723857e-4, -0.15033924542148e-2, -0.40668253562649e-1,
  -0.78847309559367e-9, 0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10,
  -0.21171472321355e-2, -0.23895741934104e2, -0.5905956432427e-17, -0.12621808899101e-5, -0.38946842435739e-1,
  0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7, 0.10406965210174e-18, -0.10234747095929e-12,
  -0.10018179379511e-8, -0.80882908646985e-10, 0.10693031879409, -0.33662250574171, 0.89185845355421e-24,
  0.30629316876232e-12, -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14,
  0.73087610595061e-28, 0.55414715350778e-16, -0.9436970724121e-6,
];

// Reducing quantities of Eq. 15: p* = 1 MPa, T* = 540 K.
const T_STAR = 540;

// Boundary between regions 2 and 3, Eq. 5 with Table 1's n1…n3 (p in MPa, T in K).
function b23PressureMpa(temperatureK: number): number {
  return 0.34805185628969e3 - 0.11671859879975e1 * temperatureK + 0.10192970039326e-2 * temperatureK ** 2;
}

/**
 * Specific enthalpy of steam, kJ/kg, at T in K and p in MPa, within region 2 up to
 * 863.15 K: 0 < p ≤ psat(T) below 623.15 K, 0 < p ≤ p_B23(T) above (IF97 §4, Fig. 1).
 */
export function region2EnthalpyKjPerKg(temperatureK: number, pressureMpa: number): number {
  if (!(temperatureK >= 273.15 && temperatureK <= 863.15)) {
    throw new RangeError(`region 2 is used here from 273.15 K to 863.15 K, got ${temperatureK} K`);
  }
  // Rounding allowance at the saturation line itself (saturated steam).
  const pMax = temperatureK <= 623.15 ? saturationPressureMpa(temperatureK) * (1 + 1e-6) : b23PressureMpa(temperatureK);
  if (!(pressureMpa > 0 && pressureMpa <= pMax)) {
    throw new RangeError(`region 2 needs 0 < p ≤ ${pMax.toPrecision(6)} MPa at ${temperatureK} K, got ${pressureMpa} MPa`);
  }
  const pi = pressureMpa;
  const tau = T_STAR / temperatureK;
  let idealTau = 0;
  for (let k = 0; k < n0.length; k++) idealTau += n0[k] * J0[k] * tau ** (J0[k] - 1);
  const b = tau - 0.5;
  let residualTau = 0;
  for (let k = 0; k < n.length; k++) residualTau += n[k] * pi ** I[k] * J[k] * b ** (J[k] - 1);
  return IF97_R * temperatureK * tau * (idealTau + residualTau);
}

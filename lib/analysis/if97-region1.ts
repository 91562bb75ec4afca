// IAPWS-IF97 region 1 (compressed and saturated liquid water): specific enthalpy.
// Source: IAPWS R7-97 (2007 revision), Eq. 7 (dimensionless Gibbs free energy),
// Table 2 (coefficients and exponents), Table 3 (h = R·T·τ·γτ), constants of Eq. 1 and Eq. 7.
// Checked against Table 5 in tests/lib/analysis/if97.test.ts.

import { saturationPressureMpa } from './if97-region4';

/** Specific gas constant of water, kJ/(kg·K) (IF97 Eq. 1). */
export const IF97_R = 0.461526;

// Table 2: I, J, n for i = 1…34.
const I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32];
const J = [
  -2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38,
  -39, -40, -41,
];
const n = [
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872,
  0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3, -0.60706301565874e-3,
  -0.18990068218419e-1, -0.32529748770505e-1, -0.21841717175414e-1, -0.5283835796993e-4, -0.47184321073267e-3,
  -0.30001780793026e-3, 0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4,
  -0.28270797985312e-5, -0.85205128120103e-9, -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12,
  -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18, 0.14478307828521e-19,
  0.26335781662795e-22, -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
];

// Reducing quantities of Eq. 7: p* = 16.53 MPa, T* = 1386 K.
const P_STAR = 16.53;
const T_STAR = 1386;

/** Specific enthalpy of liquid water, kJ/kg, at T in K and p in MPa (region 1: 273.15…623.15 K, psat(T) ≤ p ≤ 100 MPa). */
export function region1EnthalpyKjPerKg(temperatureK: number, pressureMpa: number): number {
  if (!(temperatureK >= 273.15 && temperatureK <= 623.15)) {
    throw new RangeError(`region 1 is defined from 273.15 K to 623.15 K, got ${temperatureK} K`);
  }
  // Allow rounding at the saturation line itself (saturated liquid).
  if (!(pressureMpa <= 100 && pressureMpa >= saturationPressureMpa(temperatureK) * (1 - 1e-6))) {
    throw new RangeError(`region 1 needs psat(T) ≤ p ≤ 100 MPa, got ${pressureMpa} MPa at ${temperatureK} K`);
  }
  const pi = pressureMpa / P_STAR;
  const tau = T_STAR / temperatureK;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  let gammaTau = 0;
  for (let k = 0; k < n.length; k++) gammaTau += n[k] * a ** I[k] * J[k] * b ** (J[k] - 1);
  return IF97_R * temperatureK * tau * gammaTau;
}

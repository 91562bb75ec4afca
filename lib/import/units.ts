/**
 * Unit conversions to the normalised units of a test: level in dB, surface
 * temperature in °C (BRIEF §4a "level scale").
 */

export const LEVEL_UNITS = ['dB', 'dBuV', 'mV', 'V'] as const;
export type LevelUnit = (typeof LEVEL_UNITS)[number];

export const TEMPERATURE_UNITS = ['C', 'F', 'K'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

/** Reference voltage for RMS → dB (BRIEF §4a: 1 µV unless the profile says otherwise). */
export const DEFAULT_VREF_V = 1e-6;

/**
 * Returns a function from a reading in `unit` to dB.
 * - `dB`: the meter's own scale, kept as is.
 * - `dBuV`: dB re 1 µV; shifted when the profile sets another Vref, so that
 *   dBµV and RMS-volt exports of one meter land on the same scale.
 * - `mV`, `V`: RMS voltage, 20·log10(V / Vref). Non-positive voltages have no
 *   dB value: the function returns NaN and the reader reports the row.
 */
export function levelConverter(unit: LevelUnit, vrefV: number = DEFAULT_VREF_V, offsetDb = 0): (v: number) => number {
  switch (unit) {
    case 'dB':
      return offsetDb === 0 ? (v) => v : (v) => v + offsetDb;
    case 'dBuV': {
      const shift = 20 * Math.log10(1e-6 / vrefV) + offsetDb;
      return shift === 0 ? (v) => v : (v) => v + shift;
    }
    case 'mV': {
      const k = -20 * Math.log10(vrefV * 1000) + offsetDb;
      return (v) => (v > 0 ? 20 * Math.log10(v) + k : NaN);
    }
    case 'V': {
      const k = -20 * Math.log10(vrefV) + offsetDb;
      return (v) => (v > 0 ? 20 * Math.log10(v) + k : NaN);
    }
  }
}

export function temperatureConverter(unit: TemperatureUnit): (v: number) => number {
  switch (unit) {
    case 'C':
      return (v) => v;
    case 'F':
      return (v) => ((v - 32) * 5) / 9;
    case 'K':
      return (v) => v - 273.15;
  }
}

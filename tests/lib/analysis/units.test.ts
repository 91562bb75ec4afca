// Unit conversions. Exact definitions: 1 lb = 0.45359237 kg and 1 in = 25.4 mm
// (international yard and pound agreement, 1959); 1 Btu/lb = 2.326 kJ/kg
// (International Table Btu); °F = °C × 9/5 + 32; standard gravity 9.80665 m/s².
import { describe, expect, it } from 'vitest';
import {
  PA_PER_PSI,
  barToPsi,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatFigure,
  klbToTonnes,
  tonnesToKlb,
} from '@/lib/analysis/units';

describe('conversions', () => {
  it('1 psi = 6894.757 Pa', () => expect(PA_PER_PSI).toBeCloseTo(6894.757293168, 6));
  it('10 barg = 145.04 psig', () => expect(barToPsi(10)).toBeCloseTo(145.038, 3));
  it('100 °C = 212 °F; −40 is the same in both', () => {
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(fahrenheitToCelsius(-40)).toBe(-40);
  });
  it('1 t = 2.20462 klb, and back', () => {
    expect(tonnesToKlb(1)).toBeCloseTo(2.20462, 5);
    expect(klbToTonnes(tonnesToKlb(37.5))).toBeCloseTo(37.5, 12);
  });
});

describe('formatFigure', () => {
  it.each([
    [24.5, 'massFlow', 'si', '24.5 kg/h'],
    [24.5, 'massFlow', 'us', '54.0 lb/h'],
    [184.12, 'temperature', 'us', '363.4 °F'],
    [10, 'gaugePressure', 'us', '145.0 psig'],
    [196, 'annualMass', 'si', '196.0 t/yr'],
    [196, 'annualMass', 'us', '432.1 klb/yr'],
    [44.1, 'temperatureDifference', 'us', '79.4 °F'],
    [3.2, 'length', 'us', '0.13 in'],
    [2780.71, 'specificEnthalpy', 'us', '1,195.5 Btu/lb'],
    [47.25, 'level', 'us', '47.3 dB'],
  ] as const)('%d %s in %s → %s', (value, kind, system, text) => {
    expect(formatFigure(value, kind, system).text).toBe(text);
  });
  it('a missing figure shows as a dash', () => {
    expect(formatFigure(Number.NaN, 'massFlow', 'si').text).toBe('— kg/h');
  });
});

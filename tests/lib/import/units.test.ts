import { describe, expect, it } from 'vitest';
import { levelConverter, temperatureConverter } from '@/lib/import/units';

describe('levelConverter', () => {
  it('converts RMS volts and millivolts with 20·log10(V/Vref), Vref 1 µV', () => {
    expect(levelConverter('V')(1e-6)).toBeCloseTo(0, 12);
    expect(levelConverter('V')(1e-3)).toBeCloseTo(60, 12);
    expect(levelConverter('mV')(1)).toBeCloseTo(60, 12);
    expect(levelConverter('mV')(0.1)).toBeCloseTo(40, 12);
  });

  it('uses the profile Vref and offset', () => {
    expect(levelConverter('V', 1e-3)(1e-3)).toBeCloseTo(0, 12);
    expect(levelConverter('mV', 1e-6, -2.5)(1)).toBeCloseTo(57.5, 12);
    expect(levelConverter('dB', 1e-6, 3)(40)).toBe(43);
  });

  it('keeps dBµV as is with the default Vref and rescales it for another', () => {
    expect(levelConverter('dBuV')(42)).toBe(42);
    expect(levelConverter('dBuV', 1e-3)(60)).toBeCloseTo(0, 12);
  });

  it('has no dB value for a zero or negative RMS voltage', () => {
    expect(levelConverter('V')(0)).toBeNaN();
    expect(levelConverter('mV')(-1)).toBeNaN();
  });
});

describe('temperatureConverter', () => {
  it.each([
    ['F', 212, 100],
    ['F', 32, 0],
    ['F', -40, -40],
    ['K', 273.15, 0],
    ['K', 423.15, 150],
    ['C', 151.2, 151.2],
  ] as const)('%s %d → %d °C', (unit, v, c) => {
    expect(temperatureConverter(unit)(v)).toBeCloseTo(c, 10);
  });
});

// Open/closed intervals on synthetic signals with known schedules (issue 4:
// "duty cycle within ±0.02 or one sample period ÷ test length, whichever is larger;
// open-interval count exact for clean schedules"), across 2–50 Hz, with drift,
// clicks, partial one-reading discharges and an irregular clock.
import { describe, expect, it } from 'vitest';
import { analyseTest, type TestInput } from '@/lib/analysis/analyse-test';
import type { ParamOverrides } from '@/lib/analysis/defaults';
import { irregularTimebase, regularTimebase } from '@/lib/analysis/timebase';
import { dutyTolerance, makeSignal, periodicOpenings, type Signal, type SignalSpec } from './synthetic-signal';

function analyse(spec: SignalSpec, overrides: ParamOverrides = {}, signal: Signal = makeSignal(spec)) {
  const input: TestInput = {
    timebase: signal.offsetsS ? irregularTimebase(signal.offsetsS) : regularTimebase(spec.rateHz, 0.5 / spec.rateHz),
    levelDb: signal.level,
  };
  return { signal, result: analyseTest(input, overrides).cycles };
}

const RATES = [2, 5, 10, 20, 25, 50];

describe('clean schedules across 2–50 Hz', () => {
  // A disc-like trap: 1.3 s discharges every 9.7 s (not a multiple of any period,
  // so edges fall at every phase of the sampling), 15 dB closed, 60 dB open.
  it.each(RATES)('%d Hz: exact opening count and duty cycle within tolerance', (rateHz) => {
    const openings = periodicOpenings(2.37, 9.7, 1.3, 118);
    const spec: SignalSpec = { rateHz, durationS: 120, openings, closedDb: 15, openDb: 60, noiseDb: 0.5, seed: rateHz };
    const { signal, result } = analyse(spec);
    expect(result.openIntervals).toHaveLength(openings.length);
    expect(Math.abs(result.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(dutyTolerance(rateHz, signal.testDurationS));
    // Each opening is found where it was scheduled, to within one period.
    result.openIntervals.forEach((iv, k) => {
      expect(Math.abs(iv.startS - openings[k][0])).toBeLessThanOrEqual(1 / rateHz + 1e-9);
      expect(Math.abs(iv.endS - openings[k][1])).toBeLessThanOrEqual(1 / rateHz + 1e-9);
    });
  });

  it.each(RATES)('%d Hz: open and closed time add up to the test time', (rateHz) => {
    const spec: SignalSpec = {
      rateHz,
      durationS: 60,
      openings: periodicOpenings(1.1, 7.3, 2.2, 59),
      closedDb: 18,
      openDb: 55,
      noiseDb: 1,
      seed: 7,
    };
    const { signal, result } = analyse(spec);
    const total = [...result.openIntervals, ...result.closedIntervals].reduce((a, iv) => a + iv.durationS, 0);
    expect(total).toBeCloseTo(signal.testDurationS, 9);
    expect(result.testDurationS).toBeCloseTo(60, 9);
  });

  it('cycles per minute, mean open and closed durations and mean closed level of a 10 s cycle', () => {
    const spec: SignalSpec = {
      rateHz: 20,
      durationS: 120,
      openings: periodicOpenings(5, 10, 1, 120),
      closedDb: 34,
      openDb: 62,
      noiseDb: 0.5,
      seed: 3,
    };
    const { result } = analyse(spec);
    expect(result.cyclesPerMinute).toBeCloseTo(6, 9);
    expect(result.meanCyclePeriodS).toBeCloseTo(10, 1);
    expect(result.meanOpenS!).toBeCloseTo(1, 1);
    expect(result.meanClosedS!).toBeCloseTo(9, 1);
    expect(result.meanClosedDb!).toBeCloseTo(34, 0);
  });
});

describe('2 Hz: a short discharge is one partial reading', () => {
  // 0.3 s discharges every 10 s, at phases that put some inside one reading and
  // some across two. Click rejection must stay off and the partial rise must count.
  const openings: Array<[number, number]> = [];
  for (let k = 0; k < 12; k++) openings.push([3 + 10 * k + 0.13 * k, 3.3 + 10 * k + 0.13 * k]);
  const spec: SignalSpec = { rateHz: 2, durationS: 125, openings, closedDb: 14, openDb: 50, noiseDb: 0.3, seed: 11 };

  it('no click rejection below 10 Hz; every discharge found; duty cycle within tolerance', () => {
    const { signal } = analyse(spec);
    const full = analyseTest({ timebase: regularTimebase(2, 0.25), levelDb: signal.level });
    expect(full.cycles.clickRejection).toBe(false);
    expect(full.cycles.openIntervals).toHaveLength(12);
    expect(Math.abs(full.cycles.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(dutyTolerance(2, signal.testDurationS));
  });

  it('crediting partly open edge readings is what keeps the duty cycle within tolerance', () => {
    const { signal, result: withFractions } = analyse(spec);
    const { result: whole } = analyse(spec, { intervals: { edgeFractions: false } }, signal);
    const tolerance = dutyTolerance(2, signal.testDurationS);
    expect(Math.abs(withFractions.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(tolerance);
    expect(Math.abs(whole.dutyCycle - signal.trueDuty)).toBeGreaterThan(tolerance);
  });

  it('a single high reading at 2 Hz is kept as an opening, not removed as a click', () => {
    const clickSpec: SignalSpec = { rateHz: 2, durationS: 30, openings: [], closedDb: 12, openDb: 12, clicks: [21], clickDb: 25, noiseDb: 0.2 };
    const { result } = analyse(clickSpec);
    expect(result.openIntervals).toHaveLength(1);
    expect(result.openIntervals[0].startIndex).toBe(21);
  });
});

describe('clicks at rates where a click can be told from a discharge', () => {
  it.each([10, 20, 50])('%d Hz: +20 dB one-reading clicks are removed and change nothing', (rateHz) => {
    const openings = periodicOpenings(4.1, 11.3, 1.5, 118);
    const clicks: number[] = [];
    for (let t = 2.05; t < 118; t += 3.7) {
      const inOpening = openings.some(([s, e]) => t > s - 0.5 && t < e + 0.5);
      if (!inOpening) clicks.push(Math.round(t * rateHz));
    }
    const spec: SignalSpec = { rateHz, durationS: 120, openings, closedDb: 16, openDb: 58, noiseDb: 0.5, clicks, clickDb: 20, seed: 5 };
    const { signal, result } = analyse(spec);
    expect(clicks.length).toBeGreaterThan(20);
    expect(result.clickRejection).toBe(true);
    expect(result.openIntervals).toHaveLength(openings.length);
    expect(Math.abs(result.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(dutyTolerance(rateHz, signal.testDurationS));
    // The clicks are gone from the smoothed level: no closed interval peaks near a click's height.
    for (const iv of result.closedIntervals) expect(iv.maxDb).toBeLessThan(16 + 8);
    expect(result.meanClosedDb!).toBeCloseTo(16, 0);
  });

  it('without the median the clicks would reach the closed intervals (the check can fail)', () => {
    const spec: SignalSpec = { rateHz: 50, durationS: 30, openings: [[10, 12]], closedDb: 16, openDb: 58, noiseDb: 0.5, clicks: [250, 900, 1300], clickDb: 20 };
    const { result } = analyse(spec, { smoothing: { medianWindowSamples: 1 } });
    expect(result.clickRejection).toBe(false);
    expect(Math.max(...result.closedIntervals.map((iv) => iv.maxDb))).toBeGreaterThan(30);
  });
});

describe('drifting floor', () => {
  // The floor climbs 20 dB over 300 s (a warming line, a neighbour starting up);
  // discharges rise 20 dB above the local floor.
  const drift = (t: number) => 10 + (20 * t) / 300;
  const openings = periodicOpenings(6.2, 10.4, 1.6, 298);

  it.each([5, 50])('%d Hz: the rolling floor keeps the opening count exact and the duty cycle within tolerance', (rateHz) => {
    const spec: SignalSpec = { rateHz, durationS: 300, openings, closedDb: drift, openDb: (t) => drift(t) + 20, noiseDb: 0.7, seed: 9 };
    const { signal, result } = analyse(spec);
    expect(result.baselineMode).toBe('rolling');
    expect(result.openIntervals).toHaveLength(openings.length);
    expect(Math.abs(result.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(dutyTolerance(rateHz, signal.testDurationS));
  });

  it('one global floor (the plain p10 definition) fails on the same signal', () => {
    const spec: SignalSpec = { rateHz: 5, durationS: 300, openings, closedDb: drift, openDb: (t) => drift(t) + 20, noiseDb: 0.7, seed: 9 };
    const { signal, result } = analyse(spec, { baseline: { mode: 'global' } });
    const wrongCount = result.openIntervals.length !== openings.length;
    const wrongDuty = Math.abs(result.dutyCycle - signal.trueDuty) > dutyTolerance(5, signal.testDurationS);
    expect(wrongCount || wrongDuty).toBe(true);
  });

  it('a test no longer than the rolling window uses the single p10 of BRIEF §4a', () => {
    const spec: SignalSpec = { rateHz: 10, durationS: 25, openings: [[5, 7]], closedDb: 15, openDb: 50 };
    const { result } = analyse(spec);
    expect(result.baselineMode).toBe('global');
  });
});

describe('hysteresis and minimum dwell', () => {
  it('a dip shorter than the dwell inside one discharge does not split it; a longer gap does', () => {
    const short: SignalSpec = { rateHz: 50, durationS: 30, openings: [[10, 12], [12.1, 14]], closedDb: 15, openDb: 55, noiseDb: 0.3 };
    expect(analyse(short).result.openIntervals).toHaveLength(1);
    const long: SignalSpec = { ...short, openings: [[10, 12], [12.5, 14]] };
    expect(analyse(long).result.openIntervals).toHaveLength(2);
  });

  it('a level hovering between the close and open limits neither opens nor closes the trap', () => {
    // Floor 15 dB; 6 dB is between close (+4) and open (+8). A real opening follows.
    const spec: SignalSpec = {
      rateHz: 20,
      durationS: 60,
      openings: [[30, 33]],
      closedDb: (t) => (t > 10 && t < 20 ? 21 : 15),
      openDb: 55,
      noiseDb: 0.3,
    };
    expect(analyse(spec).result.openIntervals).toHaveLength(1);
  });

  it('a burst shorter than the dwell at 50 Hz is not an opening', () => {
    const spec: SignalSpec = { rateHz: 50, durationS: 30, openings: [[10, 10.1]], closedDb: 15, openDb: 55 };
    expect(analyse(spec).result.openIntervals).toHaveLength(0);
  });
});

describe('tests without transitions', () => {
  it('steady loud flow is one continuous opening: duty cycle 1, no cycles, no closed interval', () => {
    const { result } = analyse({ rateHz: 10, durationS: 30, openings: [], closedDb: 70, openDb: 70, noiseDb: 1 });
    expect(result.continuousFlow).toBe(true);
    expect(result.dutyCycle).toBeCloseTo(1, 12);
    expect(result.cyclesPerMinute).toBe(0);
    expect(result.closedIntervals).toHaveLength(0);
    expect(result.meanClosedDb).toBeNull();
  });

  it('a quiet test is one closed interval: duty cycle 0', () => {
    const { result } = analyse({ rateHz: 10, durationS: 30, openings: [], closedDb: 12, openDb: 12, noiseDb: 1 });
    expect(result.continuousFlow).toBe(false);
    expect(result.dutyCycle).toBe(0);
    expect(result.openIntervals).toHaveLength(0);
    expect(result.closedIntervals).toHaveLength(1);
  });
});

describe('irregular clock', () => {
  it('20 Hz with ±30 % jitter: exact opening count and duty cycle within tolerance', () => {
    const openings = periodicOpenings(3.3, 8.9, 1.1, 88);
    const spec: SignalSpec = { rateHz: 20, durationS: 90, openings, closedDb: 15, openDb: 57, noiseDb: 0.5, jitter: 0.3, seed: 4 };
    const { signal, result } = analyse(spec);
    expect(signal.offsetsS).not.toBeNull();
    expect(result.openIntervals).toHaveLength(openings.length);
    expect(Math.abs(result.dutyCycle - signal.trueDuty)).toBeLessThanOrEqual(dutyTolerance(20, signal.testDurationS));
  });
});

import { describe, expect, it } from 'vitest';
import { createWallToUtc, isKnownTimeZone, wallToUtc, zoneOffsetMs } from '@/lib/import/time-zone';

const H = 3_600_000;

describe('time zones through Intl', () => {
  it('knows real zone names and refuses made-up ones', () => {
    expect(isKnownTimeZone('Europe/London')).toBe(true);
    expect(isKnownTimeZone('Mars/Olympus_Mons')).toBe(false);
  });

  it('reads the offset in summer and winter', () => {
    expect(zoneOffsetMs('Europe/London', Date.UTC(2025, 0, 15, 12))).toBe(0);
    expect(zoneOffsetMs('Europe/London', Date.UTC(2025, 6, 15, 12))).toBe(H);
    expect(zoneOffsetMs('America/Chicago', Date.UTC(2025, 0, 15, 12))).toBe(-6 * H);
    expect(zoneOffsetMs('Asia/Kolkata', Date.UTC(2025, 0, 15, 12))).toBe(5.5 * H);
  });

  it('turns local wall times into UTC', () => {
    expect(wallToUtc(Date.UTC(2025, 3, 8, 9, 30), 'Europe/London')).toBe(Date.UTC(2025, 3, 8, 8, 30));
    expect(wallToUtc(Date.UTC(2025, 0, 8, 9, 30), 'Europe/London')).toBe(Date.UTC(2025, 0, 8, 9, 30));
    expect(wallToUtc(Date.UTC(2025, 3, 8, 9, 30), 'America/Chicago')).toBe(Date.UTC(2025, 3, 8, 14, 30));
  });

  it('reads a repeated hour (clocks going back) as its first occurrence', () => {
    // 26 Oct 2025, London: 01:30 happens at 00:30 UTC (BST) and at 01:30 UTC (GMT).
    expect(wallToUtc(Date.UTC(2025, 9, 26, 1, 30), 'Europe/London')).toBe(Date.UTC(2025, 9, 26, 0, 30));
  });

  it('moves a skipped hour (clocks going forward) forward by the gap', () => {
    // 30 Mar 2025, London: 01:30 does not exist; it is read with the offset from before, i.e. 01:30 UTC = 02:30 BST.
    expect(wallToUtc(Date.UTC(2025, 2, 30, 1, 30), 'Europe/London')).toBe(Date.UTC(2025, 2, 30, 1, 30));
  });

  it('gives the same answers from its quarter-hour cache across a transition', () => {
    const conv = createWallToUtc('Europe/London');
    for (let w = Date.UTC(2025, 9, 25, 22); w < Date.UTC(2025, 9, 26, 4); w += 7 * 60_000 + 13_000) {
      expect(conv(w)).toBe(wallToUtc(w, 'Europe/London'));
    }
    for (let w = Date.UTC(2025, 2, 29, 22); w < Date.UTC(2025, 2, 30, 4); w += 7 * 60_000 + 13_000) {
      expect(conv(w)).toBe(wallToUtc(w, 'Europe/London'));
    }
  });
});

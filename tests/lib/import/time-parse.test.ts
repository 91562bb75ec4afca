import { describe, expect, it } from 'vitest';
import { createCursor, daysFromCivil, parseDateOnly, parseDateTimeText, parseTimeOnly } from '@/lib/import/time-parse';

describe('daysFromCivil', () => {
  it('agrees with Date.UTC across leap years and centuries', () => {
    for (const [y, m, d] of [[1970, 1, 1], [2000, 2, 29], [1900, 3, 1], [2024, 12, 31], [2025, 4, 8], [1969, 12, 31]]) {
      expect(daysFromCivil(y, m, d) * 86_400_000).toBe(Date.UTC(y, m - 1, d));
    }
  });
});

describe('parseDateTime', () => {
  it.each([
    ['2025-04-08T09:14:03.250Z', 'ymd', Date.UTC(2025, 3, 8, 9, 14, 3, 250), 0],
    ['2025-04-08T09:14:03Z', 'ymd', Date.UTC(2025, 3, 8, 9, 14, 3), 0],
    ['2025-04-08T10:14:03+01:00', 'ymd', Date.UTC(2025, 3, 8, 10, 14, 3), 3_600_000],
    ['2025-04-08T04:14:03-0500', 'ymd', Date.UTC(2025, 3, 8, 4, 14, 3), -18_000_000],
    ['2025-04-08 09:14:03', 'ymd', Date.UTC(2025, 3, 8, 9, 14, 3), NaN],
    ['2025/04/08 09:14', 'ymd', Date.UTC(2025, 3, 8, 9, 14), NaN],
    ['08.04.2025 09:14:03,5', 'dmy', Date.UTC(2025, 3, 8, 9, 14, 3, 500), NaN],
    ['8.4.2025 9:14:03', 'dmy', Date.UTC(2025, 3, 8, 9, 14, 3), NaN],
    ['08/04/2025 09:14:03.125', 'dmy', Date.UTC(2025, 3, 8, 9, 14, 3, 125), NaN],
    ['04/14/2025 2:15:07.5 PM', 'mdy', Date.UTC(2025, 3, 14, 14, 15, 7, 500), NaN],
    ['04/14/2025 12:00:00 AM', 'mdy', Date.UTC(2025, 3, 14, 0, 0, 0), NaN],
    ['04/14/2025 12:30:00 pm', 'mdy', Date.UTC(2025, 3, 14, 12, 30, 0), NaN],
    ['  2025-04-08T09:14:03Z  ', 'ymd', Date.UTC(2025, 3, 8, 9, 14, 3), 0],
  ] as const)('%s (%s)', (text, order, wall, offset) => {
    const r = parseDateTimeText(text, order);
    expect(r.wallMs).toBe(wall);
    if (Number.isNaN(offset)) expect(r.zoneOffsetMs).toBeNaN();
    else expect(r.zoneOffsetMs).toBe(offset);
  });

  it.each([
    ['2025-02-29 10:00:00', 'ymd'],
    ['2025-13-01 10:00:00', 'ymd'],
    ['31.04.2025 10:00:00', 'dmy'],
    ['08.04.25 10:00:00', 'dmy'],
    ['2025-04-08 24:00:00', 'ymd'],
    ['2025-04-08 10:60:00', 'ymd'],
    ['2025-04-08 10:00:61', 'ymd'],
    ['2025-04-08', 'ymd'],
    ['2025-04-08T10:00:00Zjunk', 'ymd'],
    ['13/14/2025 10:00:00', 'mdy'],
    ['04/14/2025 13:00:00 PM', 'mdy'],
    ['', 'ymd'],
  ] as const)('refuses %s (%s)', (text, order) => {
    expect(parseDateTimeText(text, order).wallMs).toBeNaN();
  });
});

describe('separate date and time columns', () => {
  it('reads each part and adds them', () => {
    const cur = createCursor();
    const d = parseDateOnly('09.04.2025', 0, 10, 'dmy', cur);
    const t = parseTimeOnly('09:02:03,250', 0, 12, cur);
    expect(d + t).toBe(Date.UTC(2025, 3, 9, 9, 2, 3, 250));
  });

  it('reads from inside a larger string without substrings', () => {
    const src = 'xx;08.04.2025;yy';
    expect(parseDateOnly(src, 3, 13, 'dmy', createCursor())).toBe(Date.UTC(2025, 3, 8));
  });
});

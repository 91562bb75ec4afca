/**
 * A small dedicated timestamp parser: STACK.md measured `Date.parse` at about
 * 3× `Number()` per row, and it cannot read day-first dates or decimal-comma
 * seconds anyway. It reads from a text range without making substrings.
 *
 * Accepted shapes (blanks around are ignored):
 *   date:  ymd `2025-04-08`, `2025/04/08`, `2025.04.08`;
 *          dmy `8.4.2025`, `08/04/2025`, `08-04-2025`; mdy `04/08/2025`
 *   time:  `9:14`, `09:14:03`, `09:14:03.25`, `09:14:03,250`, optional ` AM`/` PM`
 *   joint: date, then `T` or blanks (or `, `), then time
 *   zone:  `Z`, `+01:00`, `+0100`, `+01`, `-05:00` right after the time (ISO 8601)
 */

export type DateOrder = 'ymd' | 'dmy' | 'mdy';

const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant's days_from_civil). */
export function daysFromCivil(y: number, m: number, d: number): number {
  y -= m <= 2 ? 1 : 0;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

function daysInMonth(y: number, m: number): number {
  if (m === 2) return (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0 ? 29 : 28;
  return m === 4 || m === 6 || m === 9 || m === 11 ? 30 : 31;
}

/** Parse state shared by calls to avoid an object per row. */
export interface TimeCursor {
  pos: number;
  /** Offset written in the text (ms, east positive), or NaN when it names no zone. */
  zoneOffsetMs: number;
}

export function createCursor(): TimeCursor {
  return { pos: 0, zoneOffsetMs: NaN };
}

function readInt(src: string, cur: TimeCursor, end: number, maxDigits: number): number {
  let v = 0;
  let n = 0;
  let i = cur.pos;
  while (i < end && n < maxDigits) {
    const d = src.charCodeAt(i) - 48;
    if (d < 0 || d > 9) break;
    v = v * 10 + d;
    i++;
    n++;
  }
  if (n === 0) return -1;
  cur.pos = i;
  return v;
}

function isDateSep(c: number): boolean {
  return c === 45 || c === 47 || c === 46; // - / .
}

/** Reads a date at cur.pos; returns days since the epoch, or NaN. */
export function readDate(src: string, cur: TimeCursor, end: number, order: DateOrder): number {
  const a = readInt(src, cur, end, order === 'ymd' ? 4 : 2);
  if (a < 0 || cur.pos >= end) return NaN;
  const sep = src.charCodeAt(cur.pos);
  if (!isDateSep(sep)) return NaN;
  cur.pos++;
  const b = readInt(src, cur, end, 2);
  if (b < 0 || cur.pos >= end || src.charCodeAt(cur.pos) !== sep) return NaN;
  cur.pos++;
  const yStart = cur.pos;
  const c = readInt(src, cur, end, order === 'ymd' ? 2 : 4);
  if (c < 0) return NaN;
  let y: number, m: number, d: number;
  if (order === 'ymd') {
    y = a;
    m = b;
    d = c;
  } else {
    if (cur.pos - yStart !== 4) return NaN; // two-digit years are refused, not guessed
    y = c;
    m = order === 'dmy' ? b : a;
    d = order === 'dmy' ? a : b;
  }
  if (m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) return NaN;
  return daysFromCivil(y, m, d);
}

/** Reads a time of day at cur.pos (with optional AM/PM); returns ms since midnight, or NaN. */
export function readTimeOfDay(src: string, cur: TimeCursor, end: number): number {
  let h = readInt(src, cur, end, 2);
  if (h < 0 || cur.pos >= end || src.charCodeAt(cur.pos) !== 58) return NaN;
  cur.pos++;
  const mi = readInt(src, cur, end, 2);
  if (mi < 0 || mi > 59) return NaN;
  let secMs = 0;
  if (cur.pos < end && src.charCodeAt(cur.pos) === 58) {
    cur.pos++;
    const s0 = cur.pos;
    const s = readInt(src, cur, end, 2);
    if (s < 0 || s > 59 || cur.pos - s0 !== 2) return NaN;
    secMs = s * 1000;
    const c = cur.pos < end ? src.charCodeAt(cur.pos) : -1;
    if (c === 46 || c === 44) {
      cur.pos++;
      let scale = 100;
      let frac = 0;
      let n = 0;
      while (cur.pos < end) {
        const d = src.charCodeAt(cur.pos) - 48;
        if (d < 0 || d > 9) break;
        frac += d * scale;
        scale /= 10;
        cur.pos++;
        n++;
      }
      if (n === 0) return NaN;
      secMs += frac;
    }
  }
  // Optional 12-hour suffix.
  let p = cur.pos;
  while (p < end && src.charCodeAt(p) === 32) p++;
  if (p + 1 < end) {
    const c0 = src.charCodeAt(p) | 32;
    const c1 = src.charCodeAt(p + 1) | 32;
    if ((c0 === 97 || c0 === 112) && c1 === 109) {
      if (h < 1 || h > 12) return NaN;
      if (c0 === 97) h = h === 12 ? 0 : h;
      else h = h === 12 ? 12 : h + 12;
      cur.pos = p + 2;
    }
  }
  if (h > 23) return NaN;
  return h * 3_600_000 + mi * 60_000 + secMs;
}

function readZone(src: string, cur: TimeCursor, end: number): boolean {
  cur.zoneOffsetMs = NaN;
  if (cur.pos >= end) return true;
  const c = src.charCodeAt(cur.pos);
  if (c === 90 || c === 122) {
    cur.zoneOffsetMs = 0;
    cur.pos++;
    return true;
  }
  if (c !== 43 && c !== 45) return true;
  cur.pos++;
  const h0 = cur.pos;
  const h = readInt(src, cur, end, 2);
  if (h < 0 || cur.pos - h0 !== 2 || h > 14) return false;
  let m = 0;
  if (cur.pos < end && src.charCodeAt(cur.pos) === 58) cur.pos++;
  if (cur.pos < end) {
    const m0 = cur.pos;
    m = readInt(src, cur, end, 2);
    if (m < 0 || cur.pos - m0 !== 2 || m > 59) return false;
  }
  cur.zoneOffsetMs = (c === 45 ? -1 : 1) * (h * 3_600_000 + m * 60_000);
  return true;
}

function skipBlanks(src: string, cur: TimeCursor, end: number): void {
  while (cur.pos < end && src.charCodeAt(cur.pos) === 32) cur.pos++;
}

function trimEnd(src: string, start: number, end: number): number {
  while (end > start && (src.charCodeAt(end - 1) === 32 || src.charCodeAt(end - 1) === 9)) end--;
  return end;
}

/**
 * A joint date and time. Returns wall ms (as if the wall clock were UTC), or NaN.
 * cur.zoneOffsetMs tells whether the text named its own offset.
 */
export function parseDateTime(src: string, start: number, end: number, order: DateOrder, cur: TimeCursor): number {
  cur.pos = start;
  cur.zoneOffsetMs = NaN;
  skipBlanks(src, cur, end);
  end = trimEnd(src, cur.pos, end);
  const days = readDate(src, cur, end, order);
  if (days !== days) return NaN;
  const c = cur.pos < end ? src.charCodeAt(cur.pos) : -1;
  if (c === 84 || c === 116) cur.pos++;
  else if (c === 32 || c === 44) {
    cur.pos++;
    skipBlanks(src, cur, end);
  } else return NaN;
  const tod = readTimeOfDay(src, cur, end);
  if (tod !== tod) return NaN;
  if (!readZone(src, cur, end)) return NaN;
  if (cur.pos !== end) return NaN;
  return days * MS_PER_DAY + tod;
}

/** A date alone (a separate date column); returns wall ms of its midnight, or NaN. */
export function parseDateOnly(src: string, start: number, end: number, order: DateOrder, cur: TimeCursor): number {
  cur.pos = start;
  skipBlanks(src, cur, end);
  end = trimEnd(src, cur.pos, end);
  const days = readDate(src, cur, end, order);
  if (days !== days || cur.pos !== end) return NaN;
  return days * MS_PER_DAY;
}

/** A time of day alone (a separate time column); ms since midnight, or NaN. */
export function parseTimeOnly(src: string, start: number, end: number, cur: TimeCursor): number {
  cur.pos = start;
  cur.zoneOffsetMs = NaN;
  skipBlanks(src, cur, end);
  end = trimEnd(src, cur.pos, end);
  const tod = readTimeOfDay(src, cur, end);
  if (tod !== tod) return NaN;
  if (!readZone(src, cur, end)) return NaN;
  return cur.pos === end ? tod : NaN;
}

/** Convenience for whole strings (preamble values, tests). */
export function parseDateTimeText(text: string, order: DateOrder): { wallMs: number; zoneOffsetMs: number } {
  const cur = createCursor();
  const wallMs = parseDateTime(text, 0, text.length, order, cur);
  return { wallMs, zoneOffsetMs: cur.zoneOffsetMs };
}

/** Text shape of each order, for "expected ..." in problem messages. */
export function describeDateOrder(order: DateOrder): string {
  switch (order) {
    case 'ymd':
      return 'a date and time like 2025-04-08T09:14:03.250Z or 2025-04-08 09:14:03';
    case 'dmy':
      return 'a day-first date and time like 08.04.2025 09:14:03,5';
    case 'mdy':
      return 'a month-first date and time like 04/08/2025 09:14:03 or 04/08/2025 9:14:03 AM';
  }
}

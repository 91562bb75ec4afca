/**
 * Decimal numbers straight from a text range, with `.` or `,` as the decimal
 * mark. Avoids a substring and a `Number()` call per field (STACK.md: the
 * per-field work is where imports lose their time).
 *
 * Exactness: an integer mantissa below 2^53 divided or multiplied by an exact
 * power of ten up to 1e22 is one correctly rounded operation, so results equal
 * `Number()` of the same text; anything longer falls back to `Number()`.
 */

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];

export const DOT = 46;
export const COMMA = 44;

function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/** NaN when the range is not a plain decimal number (empty included). */
export function parseDecimal(src: string, start: number, end: number, decimalMark: number): number {
  while (start < end && isBlank(src.charCodeAt(start))) start++;
  while (end > start && isBlank(src.charCodeAt(end - 1))) end--;
  if (start >= end) return NaN;
  let i = start;
  let neg = false;
  let c = src.charCodeAt(i);
  if (c === 45 || c === 43) {
    neg = c === 45;
    i++;
  }
  let mant = 0;
  let digits = 0;
  let frac = 0;
  let seenMark = false;
  let any = false;
  for (; i < end; i++) {
    c = src.charCodeAt(i);
    const d = c - 48;
    if (d >= 0 && d <= 9) {
      any = true;
      if (digits < 15) {
        mant = mant * 10 + d;
        if (mant !== 0) digits++;
        if (seenMark) frac++;
      } else if (!seenMark) {
        return fallback(src, start, end, decimalMark);
      } else if (digits >= 15) {
        // Further fraction digits beyond double precision: let Number() round them.
        return fallback(src, start, end, decimalMark);
      }
    } else if (c === decimalMark && !seenMark) {
      seenMark = true;
    } else break;
  }
  if (!any) return NaN;
  let exp = 0;
  if (i < end) {
    c = src.charCodeAt(i);
    if (c !== 101 && c !== 69) return NaN;
    i++;
    let eneg = false;
    c = src.charCodeAt(i);
    if (c === 45 || c === 43) {
      eneg = c === 45;
      i++;
    }
    let edigits = 0;
    for (; i < end; i++) {
      const d = src.charCodeAt(i) - 48;
      if (d < 0 || d > 9) return NaN;
      exp = exp * 10 + d;
      edigits++;
      if (exp > 400) exp = 400;
    }
    if (edigits === 0) return NaN;
    if (eneg) exp = -exp;
  }
  const e = exp - frac;
  let v: number;
  if (e === 0) v = mant;
  else if (e < 0 && e >= -22) v = mant / POW10[-e];
  else if (e > 0 && e <= 22) v = mant * POW10[e];
  else return fallback(src, start, end, decimalMark);
  return neg ? -v : v;
}

function fallback(src: string, start: number, end: number, decimalMark: number): number {
  let s = src.slice(start, end);
  if (decimalMark === COMMA) s = s.replace(',', '.');
  // Number('') is 0 and Number('0x1f') is 31: neither is a decimal reading.
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) return NaN;
  return Number(s);
}

export function parseDecimalText(text: string, decimalMark: '.' | ','): number {
  return parseDecimal(text, 0, text.length, decimalMark === ',' ? COMMA : DOT);
}

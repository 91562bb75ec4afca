/**
 * `key: value` lines that meters write before the header row (serial number,
 * start time, sample rate, the tag the user typed on the meter…).
 */

export interface PreambleEntry {
  key: string;
  value: string;
  line: number;
}

export interface Preamble {
  entries: PreambleEntry[];
  /** Lines before the header that are not `key: value` (titles, comments). */
  otherLines: { line: number; text: string }[];
}

function unquote(s: string): string {
  const t = s.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).replace(/""/g, '"').trim() : t;
}

/**
 * One preamble line → key and value. Accepts `key: value`, `key = value`, and
 * `key<delimiter>value` with exactly one delimiter (spreadsheet-style
 * preambles); a leading `#` comment mark is dropped first.
 * A colon inside a time (`09:00`) is not taken as the separator, since a key
 * starts with a letter and does not end in a digit.
 */
export function parsePreambleLine(raw: string, delimiter: string | null): { key: string; value: string } | null {
  let text = raw.trim();
  if (!text) return null;
  text = text.replace(/^#+\s*/, '');
  // Spreadsheet-saved preambles pad every line with delimiters up to the column count.
  if (delimiter) while (text.endsWith(delimiter)) text = text.slice(0, -1).trimEnd();
  const m = /^([\p{L}][^:=]{0,59}?)\s*[:=]\s*(.*)$/u.exec(text);
  // `12:30` is a time, not a key; a key holding the delimiter is `a;b: c`, not this form.
  const colonForm = m && !(/\d$/.test(m[1]) && /^\d/.test(m[2])) && !(delimiter && m[1].includes(delimiter));
  if (colonForm) return { key: unquote(m[1]), value: unquote(m[2]) };
  // `key<delimiter>value`: a trailing delimiter leaves empty fields, which are dropped.
  if (delimiter) {
    const parts = text.split(delimiter).map(unquote);
    while (parts.length > 2 && parts[parts.length - 1] === '') parts.pop();
    if (parts.length === 2 && /^\p{L}/u.test(parts[0]) && parts[0].length <= 60) {
      const key = parts[0].replace(/[:=]\s*$/, '').trim();
      if (key) return { key, value: parts[1] };
    }
  }
  return null;
}

export function parsePreamble(lines: { line: number; text: string }[], delimiter: string | null): Preamble {
  const entries: PreambleEntry[] = [];
  const otherLines: { line: number; text: string }[] = [];
  for (const l of lines) {
    if (!l.text.trim()) continue;
    const kv = parsePreambleLine(l.text, delimiter);
    if (kv) entries.push({ ...kv, line: l.line });
    else otherLines.push(l);
  }
  return { entries, otherLines };
}

/** Value of a key, compared without case or surrounding blanks. */
export function preambleValue(p: Preamble | PreambleEntry[], key: string): string | undefined {
  const list = Array.isArray(p) ? p : p.entries;
  const k = key.trim().toLowerCase();
  return list.find((e) => e.key.trim().toLowerCase() === k)?.value;
}

/** `20 Hz`, `20`, `0.05 s`, `50 ms`, `50ms`, `100 S/s` → Hz; NaN when unreadable. */
export function parseRate(value: string, isInterval: boolean): number {
  const m = /^\s*([+]?\d+(?:[.,]\d+)?)\s*(hz|khz|s\/s|sps|ms|s|sec|seconds?)?\s*$/i.exec(value);
  if (!m) return NaN;
  const x = Number(m[1].replace(',', '.'));
  const unit = (m[2] ?? '').toLowerCase();
  if (!(x > 0)) return NaN;
  if (unit === 'khz') return x * 1000;
  if (unit === 'hz' || unit === 's/s' || unit === 'sps') return x;
  if (unit === 'ms') return 1000 / x;
  if (unit.startsWith('s')) return 1 / x;
  return isInterval ? 1 / x : x;
}

// Exported text must never run as a formula when a spreadsheet opens the file (BRIEF §7,
// "formula-injection in exported cells"). A cell that starts with one of these characters can be
// read as a formula, or as the start of one after the spreadsheet trims a tab or a line break:
//   = + - @   and the control characters tab (U+0009) and carriage return (U+000D).
// The remedy is the one spreadsheets themselves understand: a leading apostrophe marks the cell
// as text. Numbers are values, not text, and stay numbers. One function serves every export.

const FORMULA_START = /^[=+\-@\t\r]/;

export type CellValue = string | number | null;

/** True when a spreadsheet could read this text as a formula. */
export function readsAsFormula(text: string): boolean {
  return FORMULA_START.test(text);
}

/** The cell as it may be exported: risky text prefixed with `'`, numbers untouched, nothing as null. */
export function neutraliseCell(value: string): string;
export function neutraliseCell(value: number): number;
export function neutraliseCell(value: string | number | null | undefined): CellValue;
export function neutraliseCell(value: string | number | null | undefined): CellValue {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  return readsAsFormula(value) ? `'${value}` : value;
}

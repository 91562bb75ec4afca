// CSV as RFC 4180 writes it: CRLF between records, a field in double quotes when it holds a quote,
// a comma, CR or LF, and a quote inside doubled. Every text field passes through neutraliseCell
// first, so a tag or area name cannot become a formula in the spreadsheet that opens the file.
import { neutraliseCell, type CellValue } from './neutralise';

function field(value: string | number | null | undefined): string {
  const cell: CellValue = neutraliseCell(value);
  if (cell === null) return '';
  if (typeof cell === 'number') return String(cell);
  return /[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/**
 * Rows to CSV text. A UTF-8 byte-order mark goes first: spreadsheets open a file without it in a
 * legacy code page and mangle "°" and "—"; CSV readers (papaparse among them) skip it.
 */
export function toCsv(header: readonly string[], rows: readonly (readonly (string | number | null | undefined)[])[]): string {
  const lines = [header, ...rows].map((row) => row.map(field).join(','));
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

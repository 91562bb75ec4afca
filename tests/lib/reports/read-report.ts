// Report files read back the way a reader's tools would: PDF text (and drawing operators) with
// pdfjs-dist, spreadsheet cells with exceljs, CSV records with papaparse. Shared by the unit tests
// of the builders and the integration test over HTTP.
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';

export { pdfjs };

export async function readPdf(bytes: Uint8Array) {
  const doc = await pdfjs.getDocument({ data: bytes.slice() }).promise;
  const pages: { text: string; view: number[]; ops: number[] }[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const content = await page.getTextContent();
    const text = content.items.map((item) => ('str' in item ? item.str : '')).join(' ').replace(/\s+/g, ' ');
    pages.push({ text, view: page.view, ops: (await page.getOperatorList()).fnArray });
  }
  return pages;
}

export async function readWorkbook(bytes: Uint8Array) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(Buffer.from(bytes) as unknown as ArrayBuffer);
  return wb;
}

/** The rows below a sheet's header row (row 4, under the title and the status line), keyed by header. */
export function sheetRecords(ws: ExcelJS.Worksheet) {
  const header = (ws.getRow(4).values as unknown[]).slice(1) as string[];
  const out: Record<string, ExcelJS.Cell>[] = [];
  for (let r = 5; r <= ws.rowCount && ws.getRow(r).hasValues; r++) {
    const row = ws.getRow(r);
    out.push(Object.fromEntries(header.map((h, i) => [h, row.getCell(i + 1)])));
  }
  return out;
}

export const csvRecords = (bytes: Uint8Array) =>
  Papa.parse<Record<string, string | number | null>>(new TextDecoder().decode(bytes), { header: true, dynamicTyping: true, skipEmptyLines: true });

/** A number as the report prints it (en-US grouping, fixed decimals), formatted here independently. */
export const en = (v: number, digits: number) => v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { CsvTokenizer, rowTexts, tokenizeAll } from '@/lib/import/csv-tokenizer';

const require = createRequire(import.meta.url);
const spectrumDir = dirname(require.resolve('csv-spectrum/package.json'));

/** csv-spectrum's JSON is one object per data row, keyed by the header. */
function asObjects(rows: string[][]): Record<string, string>[] {
  const [header, ...data] = rows.filter((r) => !(r.length === 1 && r[0] === ''));
  return data.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i] ?? ''])));
}

const spectrum = readdirSync(join(spectrumDir, 'csvs'))
  .filter((f) => f.endsWith('.csv'))
  .map((f) => ({
    name: f.replace(/\.csv$/, ''),
    csv: readFileSync(join(spectrumDir, 'csvs', f), 'utf8'),
    // One case's JSON is a bare object instead of a one-element array.
    json: [JSON.parse(readFileSync(join(spectrumDir, 'json', f.replace(/\.csv$/, '.json')), 'utf8'))].flat() as Record<string, string>[],
  }));

function chunkedRows(text: string, size: number, delimiter = ','): string[][] {
  const rows: string[][] = [];
  const t = new CsvTokenizer({ delimiter, onRow: (r) => void rows.push(rowTexts(r)) });
  for (let i = 0; i < text.length; i += size) t.push(text.slice(i, i + size));
  t.end();
  return rows;
}

describe('CSV layer against csv-spectrum', () => {
  it('has the package cases to check', () => {
    expect(spectrum.length).toBeGreaterThanOrEqual(12);
  });

  it.each(spectrum)('$name', ({ name, csv, json }) => {
    const got = asObjects(tokenizeAll(csv, ',').rows);
    if (name === 'location_coordinates') {
      // Known erratum of csv-spectrum 2.0.0: its JSON has another phone number
      // than its CSV. Everything else in the row must match.
      expect(csv).toContain('2095257564');
      expect(got).toEqual([{ ...json[0], 'Contact Phone Number': '2095257564' }]);
      return;
    }
    expect(got).toEqual(json);
  });

  it.each(spectrum)('$name gives the same rows however the text is chunked', ({ csv }) => {
    const whole = tokenizeAll(csv, ',').rows;
    for (const size of [1, 2, 3, 5, 7, 16]) expect(chunkedRows(csv, size)).toEqual(whole);
  });
});

describe('CsvTokenizer', () => {
  it('numbers physical lines, counting line breaks inside quotes', () => {
    const { lines } = tokenizeAll('a,b\n"x\ny",1\nz,2\r\nw,3\rv,4', ',');
    expect(lines).toEqual([1, 2, 4, 5, 6]);
  });

  it('keeps a quote inside an unquoted field, and flags text after a closing quote', () => {
    const flagged: boolean[] = [];
    const rows: string[][] = [];
    const t = new CsvTokenizer({ delimiter: ';', onRow: (r) => void (rows.push(rowTexts(r)), flagged.push(r.malformedQuote)) });
    t.push('12"N;"ok";"bad "q" x";end\n');
    t.end();
    expect(rows).toEqual([['12"N', 'ok', '"bad "q" x"', 'end']]);
    expect(flagged).toEqual([true]);
  });

  it('reports a quote that never closes, with the line where it opened', () => {
    const problems: unknown[] = [];
    const t = new CsvTokenizer({ delimiter: ',', onRow: () => {}, onProblem: (p) => void problems.push(p) });
    t.push('a,b\n1,"open\n2,3\n');
    t.end();
    expect(problems).toEqual([{ code: 'csv-unterminated-quote', line: 2 }]);
  });

  it('refuses a row longer than the limit instead of buffering it', () => {
    const problems: { code: string }[] = [];
    const t = new CsvTokenizer({ delimiter: ',', maxRowChars: 100, onRow: () => {}, onProblem: (p) => void problems.push(p) });
    t.push('x'.repeat(150));
    expect(problems.map((p) => p.code)).toEqual(['csv-row-too-long']);
    expect(t.isStopped).toBe(true);
  });

  it('keeps a CRLF split across two chunks as one line break', () => {
    expect(chunkedRows('a,b\r\nc,d\r\n', 4)).toEqual([['a', 'b'], ['c', 'd']]);
  });

  it('reads plain rows (its fast path) and rows with quotes or a lone CR (its careful path) alike, at any chunking', () => {
    // Own example: every kind of row end and field, mixed, so rows switch between the two paths.
    const text = 'a,b,c\n1,2,3\r\n"q,1",x,\n\n4,,6\r7,8,9\n"multi\nline",y,z\r\nlast,row,here';
    const want = [['a', 'b', 'c'], ['1', '2', '3'], ['q,1', 'x', ''], [''], ['4', '', '6'], ['7', '8', '9'], ['multi\nline', 'y', 'z'], ['last', 'row', 'here']];
    const lines: number[] = [];
    const t = new CsvTokenizer({ delimiter: ',', onRow: (r) => void lines.push(r.line) });
    t.push(text);
    t.end();
    expect(tokenizeAll(text, ',').rows).toEqual(want);
    expect(lines).toEqual([1, 2, 3, 4, 5, 6, 7, 9]);
    for (const size of [1, 2, 3, 4, 6, 9, 13]) expect(chunkedRows(text, size)).toEqual(want);
  });

  it('reads a file with no delimiter at all as one field per row', () => {
    const text = Array.from({ length: 2000 }, (_, i) => `${i}`).join('\n') + '\n';
    const rows = tokenizeAll(text, ';').rows;
    expect(rows).toHaveLength(2000);
    expect(rows[1999]).toEqual(['1999']);
  });

  it('keeps an escaped quote split across two chunks', () => {
    expect(chunkedRows('"a""b",c\n', 3)).toEqual([['a"b', 'c']]);
  });
});

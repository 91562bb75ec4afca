// RFC 4180 (https://www.rfc-editor.org/rfc/rfc4180, §2): CRLF line breaks; fields with a quote,
// comma or line break in double quotes; a quote inside doubled. Read back with papaparse.
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from '@/lib/reports/csv';

const parse = (text: string) => Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data;

describe('toCsv', () => {
  it.each([
    ['plain', 'Boiler House', 'Boiler House'],
    ['comma', 'Tank Farm, east', '"Tank Farm, east"'],
    ['quote', 'the "old" line', '"the ""old"" line"'],
    ['line feed', 'two\nlines', '"two\nlines"'],
    ['formula', '=1+2', "'=1+2"],
    ['formula with a comma', '=SUM(1,2)', '"\'=SUM(1,2)"'],
    ['number', 12.5, '12.5'],
    ['negative number', -3, '-3'],
    ['empty', null, ''],
  ] as const)('%s: field written as %j and read back', (_name, value, written) => {
    const text = toCsv(['value', 'next'], [[value, 'x']]);
    expect(text).toBe(`\uFEFFvalue,next\r\n${written},x\r\n`);
    const expected = value === null ? '' : typeof value === 'number' ? String(value) : written.startsWith("'") || written.startsWith('"\'') ? `'${value}` : value;
    expect(parse(text)[1]).toEqual([expected, 'x']);
  });

  it('ends every record with CRLF, the header first', () => {
    const text = toCsv(['a', 'b'], [[1, 'x'], [2, 'y']]);
    expect(text.split('\r\n')).toEqual(['\uFEFFa,b', '1,x', '2,y', '']);
  });
});

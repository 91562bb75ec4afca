// Formula neutralisation (BRIEF §7; issue 6 "Reports"): text a spreadsheet could read as a formula
// gets a leading apostrophe; numbers stay numbers. The trigger characters are the ones the issue
// lists: = + - @ tab and carriage return at the start.
import { describe, expect, it } from 'vitest';
import { neutraliseCell, readsAsFormula } from '@/lib/reports/neutralise';

describe('neutraliseCell', () => {
  it.each([
    ['=1+2', "'=1+2"],
    ['=HYPERLINK("http://example.invalid","x")', '\'=HYPERLINK("http://example.invalid","x")'],
    ['+41 22', "'+41 22"],
    ['-2+3', "'-2+3"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\t=1+2', "'\t=1+2"],
    ['\r=1+2', "'\r=1+2"],
    ['-', "'-"],
    // already neutralised text is text again, so it gets no second apostrophe
    ["'=1+2", "'=1+2"],
    ['FV-EVP-031', 'FV-EVP-031'],
    ['Boiler House', 'Boiler House'],
    ['a=b', 'a=b'],
    [' =1+2', ' =1+2'],
    ['', ''],
    ['leaking', 'leaking'],
  ])('text %j → %j', (input, expected) => {
    expect(neutraliseCell(input)).toBe(expected);
    expect(readsAsFormula(input)).toBe(expected !== input);
  });

  it.each([
    [0, 0],
    [-12.5, -12.5],
    [1e6, 1e6],
    [0.25, 0.25],
  ])('number %d stays the number %d', (input, expected) => {
    expect(neutraliseCell(input)).toBe(expected);
    expect(typeof neutraliseCell(input)).toBe('number');
  });

  it.each([
    [null, null],
    [undefined, null],
    [Number.NaN, null],
    [Number.POSITIVE_INFINITY, null],
  ])('%s → empty cell', (input, expected) => {
    expect(neutraliseCell(input as number | null | undefined)).toBe(expected);
  });
});

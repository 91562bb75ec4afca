import { describe, expect, it } from 'vitest';
import { parseDecimalText } from '@/lib/import/number-parse';

describe('parseDecimal', () => {
  it.each(['0', '12', '-3.5', '+7.25', '0.1', '.5', '12.', '1e3', '1.259e-4', '-2.5E+2', '123456789.123456', '0.000001', '98.6', '1744102800.25', '1744271100000'])(
    'reads %s exactly as Number() does',
    (s) => {
      expect(parseDecimalText(s, '.')).toBe(Number(s));
      expect(parseDecimalText(s.replace('.', ','), ',')).toBe(Number(s));
    },
  );

  it('reads long mantissas by falling back to Number()', () => {
    expect(parseDecimalText('3.14159265358979323846', '.')).toBe(Math.PI);
    expect(parseDecimalText('12345678901234567890', '.')).toBe(12345678901234567890);
  });

  it.each(['', ' ', 'abc', '1.2.3', '1,5', '--1', '1e', '0x1f', 'NaN', 'Infinity', '12 dB'])('refuses "%s" with "." as decimal mark', (s) => {
    expect(parseDecimalText(s, '.')).toBeNaN();
  });

  it('ignores blanks around the number', () => {
    expect(parseDecimalText('  45,2 ', ',')).toBe(45.2);
  });
});

import iconv from 'iconv-lite';
import { describe, expect, it } from 'vitest';
import { createDecoder, decodeAll, detectEncoding, EncodingError, utf8Check } from '@/lib/import/encoding';

const text = 'Zeit;Messstelle;Temperatur (°C)\n08.04.2025 09:30:00;FV-EVP-031;151,2\n';

describe('detectEncoding', () => {
  it.each([
    ['UTF-8 with BOM', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text)]), 'utf-8', 3],
    ['UTF-16LE with BOM', Buffer.concat([Buffer.from([0xff, 0xfe]), iconv.encode(text, 'utf-16le')]), 'utf-16le', 2],
    ['UTF-16BE with BOM', Buffer.concat([Buffer.from([0xfe, 0xff]), iconv.encode(text, 'utf-16be')]), 'utf-16be', 2],
    ['UTF-16LE without BOM', iconv.encode(text, 'utf-16le'), 'utf-16le', 0],
    ['UTF-16BE without BOM', iconv.encode(text, 'utf-16be'), 'utf-16be', 0],
    ['UTF-8 without BOM', Buffer.from(text), 'utf-8', 0],
    ['Windows-1252', iconv.encode(text, 'windows-1252'), 'windows-1252', 0],
  ])('%s', (_name, bytes, encoding, bom) => {
    const g = detectEncoding(new Uint8Array(bytes));
    expect(g.encoding).toBe(encoding);
    expect(g.bomLength).toBe(bom);
    expect(decodeAll(new Uint8Array(bytes), g.encoding, g.bomLength)).toBe(text);
  });

  it('says why it fell back to Windows-1252, naming the bad byte', () => {
    const g = detectEncoding(new Uint8Array(iconv.encode('Temp °F', 'windows-1252')));
    expect(g.reason).toContain('0xb0');
    expect(g.confidence).toBeLessThan(1);
  });
});

describe('utf8Check', () => {
  it('does not hold a character cut by the end of a prefix sample against the file', () => {
    const bytes = new Uint8Array(Buffer.from('ab°'));
    expect(utf8Check(bytes.subarray(0, 3), false).badAt).toBe(-1);
    expect(utf8Check(bytes.subarray(0, 3), true).badAt).toBe(2);
  });

  it.each([
    ['overlong form', [0xc0, 0xaf]],
    ['surrogate', [0xed, 0xa0, 0x80]],
    ['past U+10FFFF', [0xf4, 0x90, 0x80, 0x80]],
    ['stray continuation', [0x41, 0x80]],
  ])('refuses a %s', (_n, b) => {
    expect(utf8Check(new Uint8Array(b), true).badAt).toBeGreaterThanOrEqual(0);
  });
});

describe('createDecoder', () => {
  it('decodes a character split across chunks', () => {
    const bytes = Buffer.from('x°y€z');
    const d = createDecoder('utf-8');
    let out = '';
    for (const b of bytes) out += d.write(new Uint8Array([b]));
    expect(out + d.end()).toBe('x°y€z');
  });

  it('throws an EncodingError with the byte offset for invalid UTF-8', () => {
    const d = createDecoder('utf-8');
    d.write(new Uint8Array(Buffer.from('valid text ')));
    expect(() => d.write(new Uint8Array([0x41, 0xe9, 0x42]))).toThrow(EncodingError);
  });
});

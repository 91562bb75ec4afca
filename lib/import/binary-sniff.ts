/**
 * Recognises files that are not delimited text before any parsing, so that a
 * photo renamed `.csv` is refused as "a PNG image", not as 40,000 bad rows.
 */

const SIGNATURES: { name: string; bytes: number[] }[] = [
  { name: 'a PNG image', bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] },
  { name: 'a JPEG image', bytes: [0xff, 0xd8, 0xff] },
  { name: 'a GIF image', bytes: [0x47, 0x49, 0x46, 0x38] },
  { name: 'a PDF document', bytes: [0x25, 0x50, 0x44, 0x46, 0x2d] },
  { name: 'a zip archive (or a spreadsheet, which is one)', bytes: [0x50, 0x4b, 0x03, 0x04] },
  { name: 'an empty zip archive', bytes: [0x50, 0x4b, 0x05, 0x06] },
  { name: 'a gzip archive', bytes: [0x1f, 0x8b] },
  { name: 'a 7-Zip archive', bytes: [0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c] },
  { name: 'an old-style Office document', bytes: [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1] },
  { name: 'a SQLite database', bytes: [0x53, 0x51, 0x4c, 0x69, 0x74, 0x65, 0x20, 0x66] },
];

/** What the bytes are when they are surely not text, else null. */
export function sniffBinary(bytes: Uint8Array, textEncodingIsWide: boolean): string | null {
  for (const sig of SIGNATURES) {
    if (bytes.length >= sig.bytes.length && sig.bytes.every((b, i) => bytes[i] === b)) return sig.name;
  }
  if (textEncodingIsWide) return null; // UTF-16 text is full of zero bytes by nature
  const n = Math.min(bytes.length, 8192);
  let control = 0;
  for (let i = 0; i < n; i++) {
    const b = bytes[i];
    if (b === 0) return 'binary data (it contains zero bytes)';
    if (b < 32 && b !== 9 && b !== 10 && b !== 13 && b !== 12) control++;
  }
  if (n > 0 && control / n > 0.05) return 'binary data (many control characters)';
  return null;
}

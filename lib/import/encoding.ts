import { isAscii, isUtf8 } from 'node:buffer';
import iconv from 'iconv-lite';

/** The text encodings a meter export may come in. */
export const TEXT_ENCODINGS = ['utf-8', 'utf-16le', 'utf-16be', 'windows-1252'] as const;
export type TextEncodingName = (typeof TEXT_ENCODINGS)[number];

export interface EncodingGuess {
  encoding: TextEncodingName;
  /** Bytes of byte-order mark at the start (skipped when decoding). */
  bomLength: number;
  /** 0..1: 1 for a BOM or plain ASCII, lower for heuristics. */
  confidence: number;
  /** Why this encoding was chosen, in plain words (shown in the wizard). */
  reason: string;
}

/** How much of the start of a file detection looks at. */
export const ENCODING_SAMPLE_BYTES = 64 * 1024;

export function bomOf(bytes: Uint8Array): { encoding: TextEncodingName; length: number } | null {
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return { encoding: 'utf-8', length: 3 };
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return { encoding: 'utf-16le', length: 2 };
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return { encoding: 'utf-16be', length: 2 };
  return null;
}

/**
 * Checks UTF-8 well-formedness of a sample. A multi-byte sequence cut by the
 * end of the sample is not held against it (the sample is a prefix of the file).
 * Returns the offset of the first bad byte, or -1 when valid, plus whether any
 * non-ASCII byte was seen.
 */
export function utf8Check(bytes: Uint8Array, isWholeFile: boolean): { badAt: number; nonAscii: boolean } {
  // Node's own checks first (most exports are plain ASCII); the loop below finds where and why.
  if (isAscii(bytes)) return { badAt: -1, nonAscii: false };
  if (isUtf8(bytes)) return { badAt: -1, nonAscii: true };
  let nonAscii = false;
  const n = bytes.length;
  let i = 0;
  while (i < n) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    nonAscii = true;
    let need: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) {
      need = 1;
      min = 0x80;
    } else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      min = 0x800;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      min = 0x10000;
    } else return { badAt: i, nonAscii };
    if (i + need >= n) {
      // The sequence runs past the end of the bytes. In a prefix sample that is
      // only a cut, so judge it by the bytes present; in a whole file it is bad.
      if (isWholeFile) return { badAt: i, nonAscii };
      for (let k = i + 1; k < n; k++) if ((bytes[k] & 0xc0) !== 0x80) return { badAt: i, nonAscii };
      return { badAt: -1, nonAscii };
    }
    let cp = b & (need === 1 ? 0x1f : need === 2 ? 0x0f : 0x07);
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if ((c & 0xc0) !== 0x80) return { badAt: i, nonAscii };
      cp = (cp << 6) | (c & 0x3f);
    }
    // Overlong forms, surrogates and values past U+10FFFF are not UTF-8.
    if (cp < min || (cp >= 0xd800 && cp <= 0xdfff) || cp > 0x10ffff) return { badAt: i, nonAscii };
    i += need + 1;
  }
  return { badAt: -1, nonAscii };
}

const UTF16_SNIFF_BYTES = 4096;

/**
 * UTF-16 without a BOM: text of this trade is mostly ASCII, so every other
 * byte is zero. Which half is zero tells the byte order.
 */
function utf16WithoutBom(bytes: Uint8Array): TextEncodingName | null {
  // The first few kilobytes tell as well as the whole sample.
  const sample = bytes.subarray(0, UTF16_SNIFF_BYTES);
  const pairs = Math.floor(sample.length / 2);
  if (pairs < 4) return null;
  let zeroEven = 0;
  let zeroOdd = 0;
  for (let i = 0; i + 1 < sample.length; i += 2) {
    if (sample[i] === 0) zeroEven++;
    if (sample[i + 1] === 0) zeroOdd++;
  }
  if (zeroOdd / pairs > 0.4 && zeroEven / pairs < 0.05) return 'utf-16le';
  if (zeroEven / pairs > 0.4 && zeroOdd / pairs < 0.05) return 'utf-16be';
  return null;
}

/** Detects the encoding from the start of a file (a prefix is enough). */
export function detectEncoding(bytes: Uint8Array, isWholeFile = bytes.length <= ENCODING_SAMPLE_BYTES): EncodingGuess {
  const bom = bomOf(bytes);
  if (bom) return { encoding: bom.encoding, bomLength: bom.length, confidence: 1, reason: `byte-order mark for ${bom.encoding.toUpperCase()}` };
  const sample = bytes.subarray(0, ENCODING_SAMPLE_BYTES);
  const wide = utf16WithoutBom(sample);
  if (wide) return { encoding: wide, bomLength: 0, confidence: 0.8, reason: `no byte-order mark, but every other byte is zero as in ${wide.toUpperCase()}` };
  const check = utf8Check(sample, isWholeFile && sample.length === bytes.length);
  if (check.badAt < 0) {
    return check.nonAscii
      ? { encoding: 'utf-8', bomLength: 0, confidence: 0.95, reason: 'valid UTF-8 with non-ASCII characters' }
      : { encoding: 'utf-8', bomLength: 0, confidence: 1, reason: 'plain ASCII (read as UTF-8)' };
  }
  return {
    encoding: 'windows-1252',
    bomLength: 0,
    confidence: 0.6,
    reason: `not valid UTF-8 (byte 0x${sample[check.badAt].toString(16)} at offset ${check.badAt}); read as Western single-byte (Windows-1252)`,
  };
}

export interface StreamingDecoder {
  /** Decodes the next chunk; a character split across chunks is held back. */
  write(bytes: Uint8Array): string;
  end(): string;
}

export class EncodingError extends Error {
  constructor(
    message: string,
    readonly byteOffset: number,
  ) {
    super(message);
  }
}

/**
 * A chunk decoder. UTF-8 is decoded strictly: a file detected as UTF-8 from its
 * start that turns invalid later is reported, not silently filled with U+FFFD.
 */
export function createDecoder(encoding: TextEncodingName, skipBytes = 0): StreamingDecoder {
  let toSkip = skipBytes;
  let seen = 0;
  const skip = (bytes: Uint8Array): Uint8Array => {
    if (toSkip <= 0) return bytes;
    const cut = Math.min(toSkip, bytes.length);
    toSkip -= cut;
    return bytes.subarray(cut);
  };
  if (encoding === 'windows-1252') {
    const dec = iconv.getDecoder('windows-1252');
    return {
      write: (bytes) => dec.write(toBuffer(skip(bytes))),
      end: () => dec.end() ?? '',
    };
  }
  const dec = new TextDecoder(encoding, { fatal: encoding === 'utf-8', ignoreBOM: true });
  return {
    write(bytes) {
      const b = skip(bytes);
      try {
        const s = dec.decode(b, { stream: true });
        seen += b.length;
        return s;
      } catch {
        throw new EncodingError(`the text is not valid ${encoding.toUpperCase()} within bytes ${seen}–${seen + b.length}`, seen);
      }
    },
    end() {
      try {
        return dec.decode();
      } catch {
        throw new EncodingError(`the text ends inside a ${encoding.toUpperCase()} character`, seen);
      }
    },
  };
}

function toBuffer(bytes: Uint8Array): Buffer {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

/** Decodes a whole buffer (detection samples, small files). */
export function decodeAll(bytes: Uint8Array, encoding: TextEncodingName, skipBytes = 0): string {
  const d = createDecoder(encoding, skipBytes);
  return d.write(bytes) + d.end();
}

import { createHash } from 'node:crypto';
import { normaliseWord } from './header-vocabulary';

/**
 * A header fingerprint recognises a layout on later uploads. It is made only of
 * what the meter writes the same in every export — the delimiter, the header
 * names, the preamble keys (not their values), a units row — so new readings,
 * other tags or another day leave it unchanged, while a renamed, added or
 * moved column changes it.
 */
export interface FingerprintInput {
  delimiter: string;
  header: readonly string[];
  preambleKeys: readonly string[];
  unitsRow: boolean;
  /** For files without a header row: the number of columns stands for the names. */
  columnCount?: number;
}

export function headerFingerprint(input: FingerprintInput): string {
  const keys = [...new Set(input.preambleKeys.map(normaliseWord))].sort();
  const canonical = JSON.stringify({
    d: input.delimiter,
    h: input.header.map(normaliseWord),
    k: keys,
    u: input.unitsRow,
    n: input.header.length ? input.header.length : (input.columnCount ?? 0),
  });
  return `hf1:${createHash('sha256').update(canonical).digest('hex').slice(0, 32)}`;
}

/** The fingerprint files of a profile's layout have: the profile's own, else made from its layout. */
export function profileFingerprint(p: { fingerprint?: string; delimiter: string; header: readonly string[]; preambleKeys: readonly string[]; unitsRow: boolean }): string {
  return p.fingerprint ?? headerFingerprint({ delimiter: p.delimiter, header: p.header, preambleKeys: p.preambleKeys, unitsRow: p.unitsRow });
}

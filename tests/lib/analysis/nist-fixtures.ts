// Reads the NIST StRD univariate files copied into fixtures/nist/ (tests may do
// I/O; lib/analysis may not). The certified values are read from the file's own
// "Certified Values" block, not typed in here.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface NistDataset {
  name: string;
  values: number[];
  certifiedMean: string;
  certifiedSd: string;
  certifiedLag1: string;
  certifiedCount: number;
}

const dir = fileURLToPath(new URL('../../../fixtures/nist/', import.meta.url));

function certified(text: string, label: RegExp): string {
  const line = text.split('\n').find((l) => label.test(l) && !l.startsWith('#'));
  if (!line) throw new Error(`no certified line matching ${label}`);
  const m = line.match(/(-?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?)\s*(?:\(exact\))?\s*$/);
  if (!m) throw new Error(`no number in "${line}"`);
  return m[1];
}

export function readNistDataset(name: string): NistDataset {
  const text = readFileSync(`${dir}${name}.dat`, 'utf8');
  const lines = text.split(/\r?\n/);
  // Parsing note in the file: skip to the line after "Data: Y" (the dashes), values follow.
  const dataAt = lines.findIndex((l) => /^Data:\s*Y\s*$/.test(l.trim()));
  if (dataAt < 0) throw new Error(`${name}: no "Data: Y" line`);
  const values = lines
    .slice(dataAt + 2)
    .map((l) => l.trim())
    .filter((l) => l.length > 0)
    .map(Number);
  return {
    name,
    values,
    certifiedMean: certified(text, /^Sample Mean/),
    certifiedSd: certified(text, /^Sample Standard Deviation/),
    certifiedLag1: certified(text, /^Sample Autocorrelation/),
    certifiedCount: Number(certified(text, /^Number of Observations/)),
  };
}

/**
 * Log relative error, the score NIST gives software on StRD: the number of
 * correct significant digits, −log10(|computed − certified| / |certified|),
 * capped at 15 (certified values carry 15 digits or are exact).
 */
export function logRelativeError(computed: number, certifiedText: string): number {
  const certified = Number(certifiedText);
  if (computed === certified) return 15;
  return Math.min(15, -Math.log10(Math.abs(computed - certified) / Math.abs(certified)));
}

// The meter fixtures with their expected tests (fixtures/meters/*.expected.json), and a
// register CSV for their trap tags, shared by the pipeline tests.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ExpectedFile } from '@/fixtures/meters/expected-types';
import { parseInstrumentProfile, type InstrumentProfile } from '@/lib/import/instrument-profile';

export const METERS = join(__dirname, '../../../fixtures/meters');

export interface MeterFixture {
  rel: string;
  path: string;
  fileName: string;
  expected: ExpectedFile;
  bytes: Uint8Array;
}

export const METER_FIXTURES: MeterFixture[] = readdirSync(METERS, { recursive: true, encoding: 'utf8' })
  .filter((f) => f.endsWith('.expected.json'))
  .sort()
  .map((f) => {
    const rel = f.replace(/\.expected\.json$/, '');
    const expected = JSON.parse(readFileSync(join(METERS, f), 'utf8')) as ExpectedFile;
    return { rel, path: join(METERS, rel), fileName: rel.split('/').pop()!, expected, bytes: new Uint8Array(readFileSync(join(METERS, rel))) };
  });

export function loadProfile(rel: string): InstrumentProfile {
  const r = parseInstrumentProfile(readFileSync(join(METERS, rel), 'utf8'));
  if (!r.ok) throw new Error(`${rel}: ${r.issues.join('; ')}`);
  return r.profile;
}

/** Every trap tag of the fixtures (sorted), from the expected files. */
export function fixtureTrapTags(): string[] {
  const tags = new Set<string>();
  for (const f of METER_FIXTURES) for (const t of f.expected.tests) if (t.role === 'trap') tags.add(t.tag);
  return [...tags].sort();
}

const TYPES = ['thermodynamic_disc', 'inverted_bucket', 'thermostatic_balanced_pressure', 'float_thermostatic', 'thermostatic_bimetallic'] as const;

/**
 * A register for the fixture tags: types in turn, pressures 4–12 barg, DN 15/20/25, all in
 * service. Types and pressures are ours, chosen only so that every check is exercised.
 */
export function fixtureRegisterCsv(tags = fixtureTrapTags()): { csv: string; rows: Map<string, { type: string; pressureBarg: number; sizeDn: number }> } {
  const rows = new Map<string, { type: string; pressureBarg: number; sizeDn: number }>();
  const lines = ['tag,trap_type,pressure_barg,size_dn,status'];
  tags.forEach((tag, i) => {
    const row = { type: TYPES[i % TYPES.length], pressureBarg: 4 + (i % 9), sizeDn: [15, 20, 25][i % 3] };
    rows.set(tag, row);
    lines.push(`${tag},${row.type},${row.pressureBarg},${row.sizeDn},in_service`);
  });
  return { csv: `${lines.join('\n')}\n`, rows };
}

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readZip, ZipLimitError } from '@/lib/import/zip-read';
import { writeZip } from '@/fixtures/meters/zip-writer';

const ROOT = join(__dirname, '../../../fixtures/meters');
const fixture = (rel: string) => new Uint8Array(readFileSync(join(ROOT, rel)));

describe('readZip on the day-folder zip', () => {
  const zip = readZip(fixture('zips/day-2025-04-08.zip'), {}, 'day.zip');

  it('lists the data entries with their folder hints', () => {
    expect(zip.problems).toEqual([]);
    expect(zip.entries.map((e) => [e.name, e.dateHint, e.areaHint])).toEqual([
      ['2025-04-08/Evaporator Hall/A_FV-EVP-031_20250408T091403.csv', '2025-04-08', 'Evaporator Hall'],
      ['2025-04-08/Evaporator Hall/A_FV-EVP-031-REF_20250408T091452.csv', '2025-04-08', 'Evaporator Hall'],
      ['2025-04-08/CIP Kitchen/B_2025-04-08.csv', '2025-04-08', 'CIP Kitchen'],
    ]);
    expect(zip.entries[0].hints).toEqual(['2025-04-08', 'Evaporator Hall']);
    expect(zip.entries[0].baseName).toBe('A_FV-EVP-031_20250408T091403.csv');
  });

  it('skips and lists junk with the reason', () => {
    expect(zip.skipped).toEqual([
      { name: '2025-04-08/CIP Kitchen/', reason: 'a folder' },
      { name: '2025-04-08/.DS_Store', reason: 'macOS folder settings (.DS_Store)' },
      { name: '__MACOSX/2025-04-08/._B_2025-04-08.csv', reason: 'macOS resource data (__MACOSX)' },
      { name: '2025-04-08/CIP Kitchen/valve photo.jpg', reason: 'not a data file (.jpg)' },
    ]);
  });

  it('inflates each entry to the original bytes, whole or streamed', async () => {
    const original = fixture('model-b/B_2025-04-08.csv');
    const r = zip.entries[2].read();
    expect(r.ok && Buffer.from(r.bytes).equals(Buffer.from(original))).toBe(true);
    const again = readZip(fixture('zips/day-2025-04-08.zip'));
    const parts: Uint8Array[] = [];
    for await (const c of again.entries[2].chunks()) parts.push(c);
    expect(Buffer.concat(parts).equals(Buffer.from(original))).toBe(true);
  });
});

describe('readZip refusals', () => {
  it('refuses path-traversal and absolute names, and keeps the safe entry', () => {
    const zip = readZip(fixture('zips/traversal.zip'), {}, 'traversal.zip');
    expect(zip.problems.map((p) => [p.code, p.entry])).toEqual([
      ['zip-entry-unsafe-name', '../../etc/cron.d/evil.csv'],
      ['zip-entry-unsafe-name', '/var/tmp/abs.csv'],
      ['zip-entry-unsafe-name', 'C:\\Windows\\evil.csv'],
      ['zip-entry-unsafe-name', 'area/../../up.csv'],
    ]);
    expect(zip.problems[0].message).toContain('climbs out of the zip');
    expect(zip.entries.map((e) => e.name)).toEqual(['Tank Farm Tracing/F_SM-TRC-120.txt']);
    expect(zip.entries[0].areaHint).toBe('Tank Farm Tracing');
  });

  it('reports a truncated zip', () => {
    const zip = readZip(fixture('zips/truncated.zip'), {}, 'truncated.zip');
    expect(zip.problems.map((p) => p.code)).toEqual(['zip-truncated']);
    expect(zip.problems[0].message).toMatch(/^truncated\.zip: the zip ends early/);
    expect(zip.entries).toEqual([]);
  });

  it('reports a zero-byte zip and bytes that are no zip', () => {
    expect(readZip(fixture('zips/zero-byte.zip')).problems.map((p) => p.code)).toEqual(['zip-empty']);
    expect(readZip(fixture('model-a/A_FV-EVP-031_20250408T091403.csv')).problems.map((p) => p.code)).toEqual(['zip-not-zip']);
  });

  it('refuses more entries than the limit before reading any', () => {
    const files = Array.from({ length: 12 }, (_, i) => ({ name: `f${i}.csv`, data: Buffer.from('a,b\n') }));
    const zip = readZip(writeZip(files), { maxEntries: 10 });
    expect(zip.problems.map((p) => p.code)).toEqual(['zip-too-many-entries']);
    expect(zip.entries).toEqual([]);
  });

  it('reports an entry whose data does not match its checksum', () => {
    const bytes = writeZip([{ name: 'a.csv', data: Buffer.from('a,b\n1,2\n'), store: true }]);
    bytes[30 + 'a.csv'.length] ^= 0xff; // flip the first data byte
    const r = readZip(bytes).entries[0].read();
    expect(r.ok ? null : r.problem.code).toBe('zip-entry-corrupt');
  });
});

describe('zip bombs', () => {
  // 64 MiB of zeros deflates to about 64 KiB; its header claims 1,000 bytes.
  const bombData = new Uint8Array(64 * 1024 * 1024);
  const bomb = writeZip([{ name: 'day/readings.csv', data: bombData, declaredSize: 1000 }]);

  it('stops an entry at 200× its compressed size while inflating, whatever the header claims', () => {
    const zip = readZip(bomb, {}, 'bomb.zip');
    const e = zip.entries[0];
    expect(e.declaredSize).toBe(1000);
    expect(e.compressedSize).toBeLessThan(200_000);
    const r = e.read();
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problem.code).toBe('zip-entry-ratio');
      expect(r.problem.entry).toBe('day/readings.csv');
      expect(r.problem.message).toContain('possible zip bomb');
    }
  });

  it('stops the stream too, having inflated no more than the limit', async () => {
    const e = readZip(bomb).entries[0];
    let seen = 0;
    let error: unknown = null;
    try {
      for await (const c of e.chunks()) seen += c.length;
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(ZipLimitError);
    expect((error as ZipLimitError).problem.code).toBe('zip-entry-ratio');
    expect(seen).toBeLessThanOrEqual(200 * e.compressedSize);
  });

  it('stops at the total inflated limit across entries', () => {
    // ~150 kB of varying readings: compresses a few times, far below the ratio limit.
    const text = Buffer.from(Array.from({ length: 4000 }, (_, i) => `${1744103643000 + i * 100},FV-EVP-031,${((i * 7919) % 600) / 10},${142 + (i % 13) / 10}\n`).join(''));
    const zip = readZip(writeZip([{ name: 'a.csv', data: text }, { name: 'b.csv', data: text }, { name: 'c.csv', data: text }]), { maxTotalInflatedBytes: 2.5 * text.length });
    const results = zip.entries.map((e) => e.read());
    expect(results.map((r) => (r.ok ? 'ok' : r.problem.code))).toEqual(['ok', 'ok', 'zip-total-too-large']);
  });
});

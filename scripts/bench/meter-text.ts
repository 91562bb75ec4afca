// Generated meter exports for the benchmarks, in the demo's "model A" layout (one comma-separated
// test per file, ISO 8601 UTC, dB, °C): deterministic, so two runs parse the same bytes.
import fs from 'node:fs';
import { parseInstrumentProfile, type InstrumentProfile } from '@/lib/import/instrument-profile';
import modelA from '@/fixtures/meters/model-a/model-a.profile.json';

export const HEADER = 'utc_time,trap_tag,ultrasound_db,surface_temp_c\n';
export const DAY_START = Date.UTC(2025, 3, 8, 6);

/** Rows of one test at 10 Hz: a cycling level (closed, then a discharge) and a surface near saturation. */
export function modelARows(tag: string, start: number, n: number, seed: number): string {
  const parts: string[] = [];
  let x = seed >>> 0;
  for (let i = 0; i < n; i++) {
    x = (x * 1103515245 + 12345) % 2147483648;
    const open = i % 200 < 30;
    const db = (open ? 62 : 24) + (x % 80) / 10;
    const c = 150 + (x % 70) / 10;
    parts.push(`${new Date(start + i * 100).toISOString()},${tag},${db.toFixed(1)},${c.toFixed(1)}\n`);
  }
  return parts.join('');
}

export const tagOf = (i: number) => `BX-${String(i).padStart(5, '0')}`;

/** A day of files: `files` files, `samples` readings in all, one test per file, one tag per file. */
export function dayOfFiles(files: number, samples: number): { name: string; bytes: Uint8Array; tag: string }[] {
  const per = Math.floor(samples / files);
  const enc = new TextEncoder();
  return Array.from({ length: files }, (_, i) => {
    const tag = tagOf(i);
    const start = DAY_START + i * 60_000;
    return { name: `A_${tag}.csv`, tag, bytes: enc.encode(HEADER + modelARows(tag, start, per, i + 1)) };
  });
}

/** Writes one long file of ~`bytes` bytes (a tag change every 3,000 readings) without holding it in memory. */
export function writeBigFile(path: string, bytes: number, tags = 1000): { bytes: number; tags: string[] } {
  const fd = fs.openSync(path, 'w');
  let size = 0;
  let k = 0;
  try {
    fs.writeSync(fd, HEADER);
    size += HEADER.length;
    while (size < bytes) {
      const s = modelARows(tagOf(k % tags), DAY_START + k * 400_000, 3000, k + 1);
      fs.writeSync(fd, s);
      size += s.length;
      k++;
    }
  } finally {
    fs.closeSync(fd);
  }
  return { bytes: size, tags: Array.from({ length: Math.min(k, tags) }, (_, i) => tagOf(i)) };
}

export function modelAProfile(): InstrumentProfile {
  const parsed = parseInstrumentProfile(modelA);
  if (!parsed.ok) throw new Error(`model A profile: ${parsed.issues.join('; ')}`);
  return parsed.profile;
}

/** The register the benchmarks use: every generated tag a thermodynamic trap at 10 barg. */
export const benchTrap = (tag: string, id = 0) => ({
  id, tag, trapType: 'thermodynamic_disc' as const, pressureBarg: 10, sizeDn: 15, orificeMm: null, status: 'in_service' as const,
});

import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { detectLayout, detectShape } from '@/lib/import/detect-layout';
import { parseInstrumentProfile, type InstrumentProfile } from '@/lib/import/instrument-profile';
import { readTests } from '@/lib/import/read-tests';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import type { ExpectedFile } from '@/fixtures/meters/expected-types';

/**
 * Every meter fixture read with its instrument profile must give exactly the
 * tests and problems that fixtures/meters/generate.ts wrote beside it, and
 * detection must find the layout's settings on its own.
 */

const ROOT = join(__dirname, '../../../fixtures/meters');

const cases = readdirSync(ROOT, { recursive: true, encoding: 'utf8' })
  .filter((f) => f.endsWith('.expected.json'))
  .sort()
  .map((rel) => {
    const expected = JSON.parse(readFileSync(join(ROOT, rel), 'utf8')) as ExpectedFile;
    const dataPath = join(ROOT, rel.replace(/\.expected\.json$/, ''));
    return { rel: rel.replace(/\.expected\.json$/, ''), expected, bytes: new Uint8Array(readFileSync(dataPath)) };
  });

function loadProfile(rel: string): InstrumentProfile {
  const r = parseInstrumentProfile(readFileSync(join(ROOT, rel), 'utf8'));
  if (!r.ok) throw new Error(`${rel}: ${r.issues.join('; ')}`);
  return r.profile;
}

function stats(a: Float32Array): { mean: number; min: number; max: number } {
  let s = 0;
  let min = Infinity;
  let max = -Infinity;
  for (const x of a) {
    s += x;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  return { mean: s / a.length, min, max };
}

function summary(t: NormalisedTest) {
  return {
    tag: t.tag,
    role: t.role,
    linkedTrapTag: t.linkedTrapTag,
    startedAt: new Date(t.startedAt).toISOString(),
    sampleCount: t.sampleCount,
    regular: t.timeOffsetsS === null,
    firstLine: t.source.firstLine,
    lastLine: t.source.lastLine,
  };
}

describe('meter fixtures', () => {
  it('covers at least six layouts', () => {
    const layouts = new Set(cases.map((c) => c.rel.split('/')[0]));
    expect(layouts.size).toBeGreaterThanOrEqual(6);
  });

  describe.each(cases)('$rel', ({ rel, expected, bytes }) => {
    const fileName = rel.split('/').pop()!;
    const profile = loadProfile(expected.profile);
    const result = readTests(bytes, profile, { fileName, timeZone: expected.timeZone });

    it('reads the expected tests', () => {
      expect(result.tests.map(summary)).toEqual(
        expected.tests.map((e) => ({
          tag: e.tag,
          role: e.role,
          linkedTrapTag: e.linkedTrapTag,
          startedAt: e.startedAt,
          sampleCount: e.sampleCount,
          regular: e.regular,
          firstLine: e.firstLine,
          lastLine: e.lastLine,
        })),
      );
    });

    it('derives rates and durations and converts units to dB and °C', () => {
      result.tests.forEach((t, i) => {
        const e = expected.tests[i];
        expect(t.durationS).toBeCloseTo(e.durationS, 3);
        if (e.sampleRateHz) expect(t.sampleRateHz).toBeCloseTo(e.sampleRateHz, 6);
        if (!e.regular) {
          expect(t.timeOffsetsS).not.toBeNull();
          expect(t.timeOffsetsS![0]).toBe(0);
          expect(t.timeOffsetsS![t.sampleCount - 1]).toBeCloseTo(e.durationS, 6);
        }
        const l = stats(t.levelDb);
        expect(l.mean).toBeCloseTo(e.levelDb.mean, 3);
        expect(l.min).toBeCloseTo(e.levelDb.min, 3);
        expect(l.max).toBeCloseTo(e.levelDb.max, 3);
        if (e.temperatureC === null) expect(t.temperatureC).toBeNull();
        else {
          const c = stats(t.temperatureC!);
          expect(c.mean).toBeCloseTo(e.temperatureC.mean, 3);
          expect(c.min).toBeCloseTo(e.temperatureC.min, 3);
          expect(c.max).toBeCloseTo(e.temperatureC.max, 3);
        }
        expect(t.levelDb).toBeInstanceOf(Float32Array);
        expect(t.levelDb.length).toBe(t.sampleCount);
      });
    });

    it('reports exactly the planted problems, each with its line', () => {
      const got = result.problems.filter((p) => p.code !== 'encoding-guessed').map((p) => ({ code: p.code, line: p.line }));
      expect(got).toEqual(expected.problems);
      for (const p of result.problems) {
        expect(p.file).toBe(fileName);
        expect(p.message).toContain(fileName);
      }
    });

    it('has the same fingerprint from its shape alone as from the full detection', () => {
      // The import recognises a saved layout from the shape; the wizard saves the full detection's.
      const shape = detectShape(bytes, { fileName });
      expect(shape.ok).toBe(true);
      expect(shape.fingerprint).toMatch(/^hf1:[0-9a-f]{32}$/);
      expect(shape.fingerprint).toBe(detectLayout(bytes, { fileName }).fingerprint);
      // A prefix cut mid-line (as a stream hands it over) has the same shape.
      const prefix = bytes.subarray(0, Math.min(bytes.length, 9_000));
      expect(detectShape(prefix, { fileName, isWholeFile: prefix.length === bytes.length }).fingerprint).toBe(shape.fingerprint);
    });

    it('is detected without a profile', () => {
      const d = detectLayout(bytes, { fileName });
      const want = expected.detect;
      expect(d.ok).toBe(true);
      expect(d.encoding?.encoding).toBe(want.encoding);
      expect(d.delimiter).toBe(want.delimiter);
      expect(d.decimalMark).toBe(want.decimalMark);
      expect(d.headerLine).toBe(want.headerLine);
      if (want.unitsRow) expect(d.unitsRow).not.toBeNull();
      if (want.preamble) expect(Object.fromEntries(d.preamble.entries.map((e) => [e.key, e.value]))).toEqual(want.preamble);
      const m = d.suggestedMapping!;
      expect(m.time?.value).toMatchObject(want.time);
      expect(m.level?.value).toEqual(want.level);
      if (want.temperature === null) expect(m.temperature).toBeNull();
      else expect(m.temperature?.value).toEqual(want.temperature);
      expect(m.tag?.value).toMatchObject(want.tag);
      if (want.role) expect(m.role.value).toMatchObject(want.role as object);
      for (const f of [m.time, m.level, m.tag]) expect(f!.confidence).toBeGreaterThan(0.4);
      // The suggested profile is a valid profile file.
      expect(parseInstrumentProfile(JSON.parse(JSON.stringify(d.suggestedProfile))).ok).toBe(true);
    });

    it('reads the same tests with the suggested profile as with the saved one', () => {
      const d = detectLayout(bytes, { fileName });
      const r = readTests(bytes, d.suggestedProfile!, { fileName, timeZone: expected.timeZone });
      expect(r.tests.map(summary)).toEqual(result.tests.map(summary));
    });

    it('gives the same tests when fed in small chunks', () => {
      const { createTestReaderFor } = chunked(profile, fileName, expected.timeZone);
      const r = createTestReaderFor(bytes, 997);
      expect(r.tests.map(summary)).toEqual(result.tests.map(summary));
      r.tests.forEach((t, i) => expect(Array.from(t.levelDb)).toEqual(Array.from(result.tests[i].levelDb)));
    });
  });
});

import { createTestReader } from '@/lib/import/read-tests';
function chunked(profile: InstrumentProfile, fileName: string, timeZone: string) {
  return {
    createTestReaderFor(bytes: Uint8Array, size: number) {
      const r = createTestReader(profile, { fileName, timeZone });
      for (let i = 0; i < bytes.length; i += size) r.push(bytes.subarray(i, i + size));
      return r.end();
    },
  };
}

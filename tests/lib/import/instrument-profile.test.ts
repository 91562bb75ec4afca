import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { headerFingerprint } from '@/lib/import/header-fingerprint';
import { detectLayout } from '@/lib/import/detect-layout';
import { instrumentProfileJsonSchema, parseInstrumentProfile } from '@/lib/import/instrument-profile';

const ROOT = join(__dirname, '../../../fixtures/meters');
const modelAText = readFileSync(join(ROOT, 'model-a/model-a.profile.json'), 'utf8');

describe('instrument profile schema', () => {
  it('fills defaults and survives an export/import round trip', () => {
    const r = parseInstrumentProfile(modelAText);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.profile.levelOffsetDb).toBe(0);
    expect(r.profile.level.vrefV).toBe(1e-6);
    expect(r.profile.split).toEqual({ minGapS: 5, gapPeriods: 10 });
    const again = parseInstrumentProfile(JSON.stringify(r.profile));
    expect(again.ok && again.profile).toEqual(r.profile);
  });

  it('refuses another format or version before checking fields', () => {
    const v = JSON.parse(modelAText);
    expect(parseInstrumentProfile({ ...v, version: 2 })).toEqual({ ok: false, issues: ['version: this Plumeward reads instrument profile version 1, the file is version 2'] });
    expect(parseInstrumentProfile({ ...v, format: 'something-else' }).ok).toBe(false);
    expect(parseInstrumentProfile('{not json').ok).toBe(false);
  });

  it('names the field of each problem', () => {
    const v = JSON.parse(modelAText);
    const r = parseInstrumentProfile({ ...v, delimiter: ':', tag: { from: 'file-name', pattern: '(' }, time: { kind: 'index', column: null, rateHz: null, rateKey: null, startKey: 'Start', startOrder: 'ymd', zone: null } });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues.some((i) => i.startsWith('delimiter:'))).toBe(true);
    expect(r.issues.some((i) => i.startsWith('tag.pattern: not a valid regular expression'))).toBe(true);
    expect(r.issues.some((i) => i.includes('needs rateHz or rateKey'))).toBe(true);
  });

  it('publishes a JSON Schema for the API document', () => {
    const s = instrumentProfileJsonSchema() as { properties: Record<string, unknown> };
    expect(Object.keys(s.properties)).toEqual(expect.arrayContaining(['format', 'version', 'delimiter', 'time', 'level', 'tag', 'role', 'referenceLink', 'levelOffsetDb']));
  });
});

describe('header fingerprint', () => {
  const base = { delimiter: ';', header: ['Date/time', 'Tag', 'Point', 'Sound level (dB)'], preambleKeys: ['Unit serial', 'Operator'], unitsRow: false };

  it('ignores case and spacing of names and the order of preamble keys', () => {
    expect(headerFingerprint({ ...base, header: ['date/time', ' Tag', 'POINT', 'Sound  level (dB)'], preambleKeys: ['Operator', 'Unit serial'] })).toBe(headerFingerprint(base));
  });

  it.each([
    ['another delimiter', { delimiter: ',' }],
    ['a renamed column', { header: ['Date/time', 'Tag', 'Point', 'Sound level (mV)'] }],
    ['moved columns', { header: ['Tag', 'Date/time', 'Point', 'Sound level (dB)'] }],
    ['an added column', { header: [...base.header, 'Note'] }],
    ['another preamble key', { preambleKeys: ['Unit serial', 'Site'] }],
    ['a units row', { unitsRow: true }],
  ])('changes with %s', (_n, change) => {
    expect(headerFingerprint({ ...base, ...change })).not.toBe(headerFingerprint(base));
  });

  it('recognises every file of one layout, whatever its readings, and tells layouts apart', () => {
    const a = ['model-a/A_FV-EVP-031_20250408T091403.csv', 'model-a/A_FV-EVP-031-REF_20250408T091452.csv', 'model-a/A_FV-EVP-032_20250408T092010.csv'].map(
      (rel) => detectLayout(new Uint8Array(readFileSync(join(ROOT, rel))), { fileName: rel }).fingerprint,
    );
    expect(new Set(a).size).toBe(1);
    const d = ['layout-d/D_SM-TRC-114.txt', 'model-b/B_2025-04-08.csv', 'layout-e/E_lote_07.csv'].map((rel) => detectLayout(new Uint8Array(readFileSync(join(ROOT, rel))), { fileName: rel }).fingerprint);
    expect(new Set([...d, a[0]]).size).toBe(4);
  });
});

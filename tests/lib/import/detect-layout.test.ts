import { describe, expect, it } from 'vitest';
import { detectLayout } from '@/lib/import/detect-layout';
import { nameScores, roleOfWord } from '@/lib/import/header-vocabulary';
import { parsePreambleLine, parseRate } from '@/lib/import/preamble';

const utf8 = (s: string) => new TextEncoder().encode(s);

describe('header words in five languages', () => {
  it.each([
    ['Temperature (°C)', 'temperature'],
    ['Oberflächentemperatur', 'temperature'],
    ['Température', 'temperature'],
    ['temperatura', 'temperature'],
    ['Temperatuur', 'temperature'],
    ['Sound level', 'level'],
    ['Schallpegel', 'level'],
    ['Niveau sonore', 'level'],
    ['nivel', 'level'],
    ['geluidsniveau', 'level'],
    ['Zeitstempel', 'time'],
    ['Horodatage', 'time'],
    ['marca de tiempo', 'time'],
    ['tijdstip', 'time'],
    ['Messstelle', 'tag'],
    ['Repère', 'tag'],
    ['etiqueta', 'tag'],
    ['meetpunt', 'tag'],
    ['point type', 'role'],
    ['Rolle', 'role'],
    ['type de point', 'role'],
    ['tipo de punto', 'role'],
    ['soort punt', 'role'],
  ] as const)('%s → %s', (name, kind) => {
    const s = nameScores(name);
    const best = (Object.keys(s) as (keyof typeof s)[]).sort((a, b) => s[b] - s[a])[0];
    expect(best).toBe(kind);
  });

  it.each([
    ['Trap', 'trap'], ['Ableiter', 'trap'], ['purgeur', 'trap'], ['Purgador', 'trap'], ['condenspot', 'trap'],
    ['pipe', 'reference'], ['Rohr', 'reference'], ['tuyau', 'reference'], ['tubería', 'reference'], ['leiding', 'reference'], ['valve', null],
  ] as const)('role word %s → %s', (w, role) => {
    expect(roleOfWord(w)).toBe(role);
  });
});

describe('preamble lines', () => {
  it.each([
    ['Start: 2025-04-08 09:00:00', ',', { key: 'Start', value: '2025-04-08 09:00:00' }],
    ['Repère : SM-TRC-112', '|', { key: 'Repère', value: 'SM-TRC-112' }],
    ['Starttijd = 08-04-2025 14:30:00', ';', { key: 'Starttijd', value: '08-04-2025 14:30:00' }],
    ['Serial;0457;;;', ';', { key: 'Serial', value: '0457' }],
    ['# Site: Saltmarsh Terminal', ',', { key: 'Site', value: 'Saltmarsh Terminal' }],
    ['Location: Hall 3, level 2', ',', { key: 'Location', value: 'Hall 3, level 2' }],
    ['09:30:00', ',', null],
    ['just a title', ',', null],
  ])('%s', (line, delim, want) => {
    expect(parsePreambleLine(line, delim)).toEqual(want);
  });

  it.each([
    ['20 Hz', false, 20],
    ['20', false, 20],
    ['0,5 kHz', false, 500],
    ['50 ms', true, 20],
    ['0.1 s', true, 10],
    ['0.25', true, 4],
    ['fast', false, NaN],
  ])('rate %s', (v, interval, hz) => {
    expect(parseRate(v, interval)).toBe(hz);
  });
});

describe('detectLayout', () => {
  it('finds a headerless file and still suggests columns from values', () => {
    const d = detectLayout(utf8('1744103643,FV-EVP-031,31.5\n1744103644,FV-EVP-031,35.1\n1744103645,FV-EVP-031,30.2\n'), { fileName: 'x.csv' });
    expect(d.headerLine).toBeNull();
    expect(d.columns.map((c) => c.kind)).toEqual(['epoch', 'tag', 'number']);
  });

  it('marks day/month ambiguity with a lower confidence when the separator does not settle it', () => {
    const d = detectLayout(utf8('when;tag;level dB\n04/05/2025 10:00:00;A-1;3,5\n04/05/2025 10:00:01;A-1;3,6\n'), { fileName: 'x.csv' });
    const t = d.columns[0];
    expect(t.kind).toBe('datetime');
    expect(t.dateOrder).toBe('dmy');
    expect(t.confidence).toBeLessThan(0.6);
    expect(t.reason).toContain('please check');
  });

  it('reads month-first when a day above 12 proves it', () => {
    const d = detectLayout(utf8('when,tag,level dB\n04/13/2025 10:00:00,A-1,3.5\n04/13/2025 10:00:01,A-1,3.6\n'), { fileName: 'x.csv' });
    expect(d.columns[0].dateOrder).toBe('mdy');
    expect(d.columns[0].confidence).toBeGreaterThan(0.9);
  });

  it('gives a preview and problems for a file with no data rows', () => {
    const d = detectLayout(utf8('utc_time,trap_tag,ultrasound_db\n'), { fileName: 'h.csv' });
    expect(d.ok).toBe(false);
    expect(d.problems.map((p) => p.code)).toEqual(['file-header-only']);
  });

  it('refuses non-text with what it looks like', () => {
    const d = detectLayout(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d, 0x31, 0x2e, 0x37]), { fileName: 'report.csv' });
    expect(d.problems[0].message).toBe('report.csv: this is a PDF document, not a meter export; expected delimited text (CSV, semicolon, tab or pipe separated)');
  });

  it('suggests a rate key and start key for sample-index files', () => {
    const d = detectLayout(utf8('Beginn: 2025-04-08 09:00:00\nAbtastrate: 10 Hz\nMessstelle: SM-TRC-112\nNr;Pegel [dB]\n0;20,5\n1;21,5\n2;22,5\n'), { fileName: 'x.txt' });
    expect(d.suggestedMapping?.time?.value).toMatchObject({ kind: 'index', column: 0, rateKey: 'Abtastrate', startKey: 'Beginn' });
    expect(d.suggestedMapping?.tag?.value).toEqual({ from: 'preamble', key: 'Messstelle' });
  });
});

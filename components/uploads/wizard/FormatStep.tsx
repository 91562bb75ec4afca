'use client';

import type { LayoutDetection } from '@/lib/import/detect-layout';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import { Confidence } from './Confidence';

const DELIMITER_LABELS: Record<InstrumentProfile['delimiter'], string> = { ',': 'Comma ( , )', ';': 'Semicolon ( ; )', '\t': 'Tab', '|': 'Pipe ( | )' };
const ENCODING_LABELS: Record<InstrumentProfile['encoding'], string> = {
  auto: 'Recognise per file', 'utf-8': 'UTF-8', 'utf-16le': 'UTF-16 (little-endian)', 'utf-16be': 'UTF-16 (big-endian)', 'windows-1252': 'Western single-byte (Windows-1252)',
};

/**
 * The preview rows as the chosen delimiter would split them. Detection sent the rows already
 * split on the delimiter it found; a different choice re-splits their joined text (quotes are
 * not re-read: the column preview that follows reads the real file).
 */
function previewRows(detection: LayoutDetection, delimiter: string): { line: number; fields: string[] }[] {
  if (delimiter === detection.delimiter) return detection.preview;
  return detection.preview.map((r) => ({ line: r.line, fields: r.fields.join(detection.delimiter).split(delimiter) }));
}

export function FormatStep({ detection, profile, onChange }: { detection: LayoutDetection | null; profile: InstrumentProfile; onChange: (p: InstrumentProfile) => void }) {
  const set = (patch: Partial<InstrumentProfile>) => onChange({ ...profile, ...patch });
  if (!detection) return <p className="panel p-5 text-sm">Detection did not run on this file; set the format by hand on the next step.</p>;
  const rows = previewRows(detection, profile.delimiter);
  const header = profile.header.length ? (profile.delimiter === detection.delimiter ? profile.header : profile.header.join(detection.delimiter).split(profile.delimiter)) : [];
  const width = Math.max(header.length, ...rows.map((r) => r.fields.length));
  const keys = new Set(profile.preambleKeys);

  return (
    <div className="space-y-5">
      <section className="panel grid gap-5 p-5 md:grid-cols-3">
        <label className="block">
          <span className="field-label">Text encoding</span>
          <select className="field-input" value={profile.encoding} onChange={(e) => set({ encoding: e.target.value as InstrumentProfile['encoding'] })} data-testid="setting-encoding">
            {Object.entries(ENCODING_LABELS).map(([v, l]) => <option key={v} value={v}>{l}</option>)}
          </select>
          <Confidence confidence={detection.encoding?.confidence ?? null} reason={detection.encoding ? `detected ${detection.encoding.encoding}: ${detection.encoding.reason}` : undefined} changed={!!detection.encoding && profile.encoding !== detection.encoding.encoding} />
        </label>
        <label className="block">
          <span className="field-label">Delimiter</span>
          <select className="field-input" value={profile.delimiter} onChange={(e) => set({ delimiter: e.target.value as InstrumentProfile['delimiter'] })} data-testid="setting-delimiter">
            {Object.entries(DELIMITER_LABELS).map(([v, l]) => <option key={v} value={v}>{l}</option>)}
          </select>
          <Confidence confidence={detection.delimiterConfidence} changed={profile.delimiter !== detection.delimiter} />
        </label>
        <label className="block">
          <span className="field-label">Decimal mark</span>
          <select className="field-input" value={profile.decimalMark} onChange={(e) => set({ decimalMark: e.target.value as InstrumentProfile['decimalMark'] })} data-testid="setting-decimal">
            <option value=".">Point (12.5)</option>
            <option value=",">Comma (12,5)</option>
          </select>
          <Confidence confidence={detection.decimalMarkConfidence} changed={profile.decimalMark !== detection.decimalMark} />
        </label>
      </section>

      <section className="panel grid gap-5 p-5 md:grid-cols-2">
        <div>
          <h3 className="mb-1 text-sm font-semibold">Lines before the header</h3>
          {detection.preamble.entries.length === 0 && detection.preamble.otherLines.length === 0 ? (
            <p className="text-sm text-ink-soft">None: the file starts with its header row.</p>
          ) : (
            <>
              <p className="mb-2 text-xs text-ink-soft">Ticked keys belong to the layout (the meter writes them in every export); their values may hold a start time, a rate or a tag for the next step.</p>
              <table className="data-table text-xs" data-testid="preamble">
                <thead><tr><th>Line</th><th>Key</th><th>Value in this file</th><th>Part of the layout</th></tr></thead>
                <tbody>
                  {detection.preamble.entries.map((e) => (
                    <tr key={e.line}>
                      <td>{e.line}</td><td className="font-medium">{e.key}</td><td className="tag-text">{e.value}</td>
                      <td>
                        <input
                          type="checkbox"
                          aria-label={`${e.key} is part of the layout`}
                          checked={keys.has(e.key)}
                          onChange={(ev) => set({ preambleKeys: ev.target.checked ? [...profile.preambleKeys, e.key] : profile.preambleKeys.filter((k) => k !== e.key) })}
                        />
                      </td>
                    </tr>
                  ))}
                  {detection.preamble.otherLines.map((l) => <tr key={`o${l.line}`}><td>{l.line}</td><td colSpan={3} className="text-ink-soft">{l.text} <span className="text-ink-faint">(not a key: value line, skipped)</span></td></tr>)}
                </tbody>
              </table>
            </>
          )}
        </div>
        <div className="space-y-3">
          <h3 className="text-sm font-semibold">Header row</h3>
          <p className="text-sm" data-testid="header-line">
            {detection.headerLine ? <>Line {detection.headerLine} names the columns: <span className="tag-text">{detection.header.join(' · ')}</span></> : 'No header row found: columns are known by position.'}
          </p>
          {detection.headerLine !== null && (
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={profile.header.length === 0} onChange={(e) => set({ header: e.target.checked ? [] : detection.header })} />
              Ignore the names and read columns by position (for a meter that renames its columns)
            </label>
          )}
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={profile.unitsRow} onChange={(e) => set({ unitsRow: e.target.checked })} data-testid="setting-units-row" />
            A row of units follows the header{detection.unitsRow ? ` (found: ${detection.unitsRow.join(', ')})` : ''}
          </label>
        </div>
      </section>

      <section className="panel p-5">
        <h3 className="mb-2 text-sm font-semibold">First rows, as these settings split them</h3>
        <div className="overflow-x-auto">
          <table className="data-table text-xs" data-testid="format-preview">
            <thead>
              <tr><th>Line</th>{Array.from({ length: width }, (_, i) => <th key={i}>{header[i] || `Column ${i + 1}`}</th>)}</tr>
            </thead>
            <tbody>
              {rows.slice(0, 12).map((r) => (
                <tr key={r.line}><td className="text-ink-faint">{r.line}</td>{Array.from({ length: width }, (_, i) => <td key={i} className="tag-text whitespace-nowrap">{r.fields[i] ?? ''}</td>)}</tr>
              ))}
            </tbody>
          </table>
        </div>
        {detection.problems.length > 0 && (
          <ul className="mt-3 space-y-1 text-xs text-caution-ink">
            {detection.problems.map((p, i) => <li key={i}>! {p.message}</li>)}
          </ul>
        )}
      </section>
    </div>
  );
}

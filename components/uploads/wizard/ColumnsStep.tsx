'use client';

import { useEffect, useMemo, useState } from 'react';
import type { LayoutDetection } from '@/lib/import/detect-layout';
import type { InstrumentProfile, ReferenceLink, RoleSource, TagSource, TimeSource } from '@/lib/import/instrument-profile';
import { callApi, type FieldIssue } from '../apiClient';
import { ProblemList, type Problem } from '../ProblemList';
import { Confidence } from './Confidence';
import { columnOptions, type ColumnOption } from './draftProfile';
import { Choice, ColumnSelect, ListField, NumberField, regexProblem, TextField, zoneProblem } from './Inputs';
import { PreviewChart } from './PreviewChart';

type Preview = {
  refused: boolean; testCount: number; rowCounts: Record<string, number> | null; problems: Problem[];
  tests: { tag: string; role: 'trap' | 'reference'; linkedTrapTag: string | null; startedAt: string; sampleCount: number; sampleRateHz: number; durationS: number; meanLevelDb: number | null;
    series: { t: number[]; levelDb: (number | null)[]; temperatureC: (number | null)[] | null } }[];
};

const ORDERS = [['ymd', 'Year, month, day (2025-04-08)'], ['dmy', 'Day, month, year (08.04.2025)'], ['mdy', 'Month, day, year (04/08/2025)']] as const;
const TIME_KINDS = [['datetime', 'Date and time of day'], ['epoch', 'Seconds or ms since 1970 (epoch)'], ['elapsed', 'Time since a start in the preamble'], ['index', 'Sample number at a fixed rate']] as const;
const LEVEL_UNITS = [['dB', 'dB (the meter’s scale)'], ['dBuV', 'dBµV'], ['mV', 'mV RMS → dB'], ['V', 'V RMS → dB']] as const;
const TEMP_UNITS = [['C', '°C'], ['F', '°F'], ['K', 'K']] as const;

// The reader's row counts, in words.
const ROW_COUNT_LABELS: Record<string, string> = {
  lines: 'lines', dataRows: 'data rows', readings: 'readings', skipped: 'rows skipped', blank: 'blank lines', duplicates: 'duplicate times', missingTemperature: 'rows without temperature',
};

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function Field({ title, children, note }: { title: string; children: React.ReactNode; note?: React.ReactNode }) {
  return (
    <fieldset className="space-y-3 rounded-md border border-line p-4">
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      {children}
      {note}
    </fieldset>
  );
}

function ZoneField({ zone, siteTimeZone, onChange }: { zone: string | null; siteTimeZone: string; onChange: (z: string | null) => void }) {
  const mode = zone === null ? 'site' : zone === 'UTC' ? 'utc' : 'other';
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Choice
        label="Time zone of the times"
        value={mode}
        options={[['site', `The site’s zone (${siteTimeZone})`], ['utc', 'UTC'], ['other', 'Another zone…']] as const}
        onChange={(m) => onChange(m === 'site' ? null : m === 'utc' ? 'UTC' : siteTimeZone)}
        testId="setting-zone"
      />
      {mode === 'other' && <TextField label="IANA zone" value={zone ?? ''} validate={zoneProblem} onCommit={(z) => onChange(z)} mono />}
      <p className="text-xs text-ink-faint sm:col-span-2">Times that carry their own offset (Z, +01:00) are read as written, whatever is set here.</p>
    </div>
  );
}

function PreambleKey({ label, value, keys, onChange }: { label: string; value: string; keys: string[]; onChange: (k: string) => void }) {
  const options = keys.includes(value) || !value ? keys : [value, ...keys];
  return (
    <label className="block">
      <span className="field-label">{label}</span>
      <select className="field-input" value={value} onChange={(e) => onChange(e.target.value)}>
        {!value && <option value="">Choose a preamble key</option>}
        {options.map((k) => <option key={k} value={k}>{k}</option>)}
      </select>
      {keys.length === 0 && <p className="field-error">This layout has no preamble keys (see the format step).</p>}
    </label>
  );
}

function TimeFields({ time, options, keys, siteTimeZone, onChange }: { time: TimeSource; options: ColumnOption[]; keys: string[]; siteTimeZone: string; onChange: (t: TimeSource) => void }) {
  function kind(k: TimeSource['kind']) {
    const column = 'column' in time && time.column !== null ? time.column : 0;
    const startKey = keys[0] ?? '';
    if (k === 'datetime') onChange({ kind: 'datetime', column, timeColumn: null, order: 'ymd', zone: null });
    if (k === 'epoch') onChange({ kind: 'epoch', column, unit: 's' });
    if (k === 'elapsed') onChange({ kind: 'elapsed', column, unit: 's', startKey, startOrder: 'ymd', zone: null });
    if (k === 'index') onChange({ kind: 'index', column: null, rateHz: 10, rateKey: null, startKey, startOrder: 'ymd', zone: null });
  }
  return (
    <div className="space-y-3">
      <Choice label="Times are written as" value={time.kind} options={TIME_KINDS} onChange={kind} testId="setting-time-kind" />
      {time.kind === 'datetime' && (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <ColumnSelect label="Date and time column" value={time.column} options={options} onChange={(c) => onChange({ ...time, column: c ?? 0 })} testId="setting-time-column" />
            <ColumnSelect label="Separate time-of-day column" value={time.timeColumn} options={options} allowNone="None: date and time together" onChange={(c) => onChange({ ...time, timeColumn: c })} />
          </div>
          <Choice label="Date order" value={time.order} options={ORDERS} onChange={(o) => onChange({ ...time, order: o })} testId="setting-date-order" />
          <ZoneField zone={time.zone} siteTimeZone={siteTimeZone} onChange={(z) => onChange({ ...time, zone: z })} />
        </>
      )}
      {time.kind === 'epoch' && (
        <div className="grid gap-3 sm:grid-cols-2">
          <ColumnSelect label="Epoch column" value={time.column} options={options} onChange={(c) => onChange({ ...time, column: c ?? 0 })} />
          <Choice label="Counted in" value={time.unit} options={[['s', 'seconds'], ['ms', 'milliseconds']] as const} onChange={(u) => onChange({ ...time, unit: u })} />
        </div>
      )}
      {time.kind === 'elapsed' && (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <ColumnSelect label="Elapsed-time column" value={time.column} options={options} onChange={(c) => onChange({ ...time, column: c ?? 0 })} />
            <Choice label="Counted in" value={time.unit} options={[['s', 'seconds'], ['ms', 'milliseconds']] as const} onChange={(u) => onChange({ ...time, unit: u })} />
            <PreambleKey label="Start time from" value={time.startKey} keys={keys} onChange={(k) => onChange({ ...time, startKey: k })} />
            <Choice label="Date order of the start" value={time.startOrder} options={ORDERS} onChange={(o) => onChange({ ...time, startOrder: o })} />
          </div>
          <ZoneField zone={time.zone} siteTimeZone={siteTimeZone} onChange={(z) => onChange({ ...time, zone: z })} />
        </>
      )}
      {time.kind === 'index' && (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <ColumnSelect label="Sample-number column" value={time.column} options={options} allowNone="None: the row order" onChange={(c) => onChange({ ...time, column: c })} />
            <Choice label="Sample rate from" value={time.rateKey === null ? 'fixed' : 'key'} options={[['fixed', 'A fixed rate'], ['key', 'A preamble key']] as const}
              onChange={(m) => onChange(m === 'fixed' ? { ...time, rateHz: time.rateHz ?? 10, rateKey: null } : { ...time, rateHz: null, rateKey: keys[0] ?? '' })} />
            {time.rateKey === null
              ? <NumberField label="Rate (Hz)" value={time.rateHz ?? 10} min={0.001} max={1e6} onCommit={(r) => onChange({ ...time, rateHz: r })} />
              : <PreambleKey label="Rate or interval key" value={time.rateKey} keys={keys} onChange={(k) => onChange({ ...time, rateKey: k })} />}
            <PreambleKey label="Start time from" value={time.startKey} keys={keys} onChange={(k) => onChange({ ...time, startKey: k })} />
            <Choice label="Date order of the start" value={time.startOrder} options={ORDERS} onChange={(o) => onChange({ ...time, startOrder: o })} />
          </div>
          <ZoneField zone={time.zone} siteTimeZone={siteTimeZone} onChange={(z) => onChange({ ...time, zone: z })} />
        </>
      )}
    </div>
  );
}

function TagFields({ tag, options, keys, onChange }: { tag: TagSource; options: ColumnOption[]; keys: string[]; onChange: (t: TagSource) => void }) {
  return (
    <div className="space-y-3">
      <Choice label="The tag comes from" value={tag.from} options={[['column', 'A column'], ['file-name', 'The file name'], ['preamble', 'A preamble key']] as const} testId="setting-tag-from"
        onChange={(f) => onChange(f === 'column' ? { from: 'column', column: 0 } : f === 'file-name' ? { from: 'file-name', pattern: '(?<tag>[A-Za-z]{1,6}(?:-[A-Za-z0-9]+){1,4})' } : { from: 'preamble', key: keys[0] ?? '' })} />
      {tag.from === 'column' && <ColumnSelect label="Tag column" value={tag.column} options={options} onChange={(c) => onChange({ from: 'column', column: c ?? 0 })} testId="setting-tag-column" />}
      {tag.from === 'file-name' && <TextField label="Pattern on the file name" value={tag.pattern} mono validate={regexProblem} onCommit={(p) => onChange({ from: 'file-name', pattern: p })} hint='A regular expression; the group named "tag" (or the first group) is the tag.' />}
      {tag.from === 'preamble' && <PreambleKey label="Tag key" value={tag.key} keys={keys} onChange={(k) => onChange({ from: 'preamble', key: k })} />}
    </div>
  );
}

function RoleFields({ role, options, keys, onChange }: { role: RoleSource; options: ColumnOption[]; keys: string[]; onChange: (r: RoleSource) => void }) {
  const values = 'referenceValues' in role ? { trapValues: role.trapValues, referenceValues: role.referenceValues } : { trapValues: ['trap'], referenceValues: ['pipe', 'reference'] };
  return (
    <div className="space-y-3">
      <Choice label="Trap point or reference point" value={role.from} testId="setting-role-from"
        options={[['none', 'Every test is on a trap'], ['column', 'A column says'], ['tag-pattern', 'Tags of a pattern are reference points'], ['preamble', 'A preamble key says']] as const}
        onChange={(f) => onChange(f === 'none' ? { from: 'none' } : f === 'column' ? { from: 'column', column: 0, ...values } : f === 'tag-pattern' ? { from: 'tag-pattern', pattern: '[-_ ](ref|pipe)$' } : { from: 'preamble', key: keys[0] ?? '', ...values })} />
      {role.from === 'column' && <ColumnSelect label="Point column" value={role.column} options={options} onChange={(c) => onChange({ ...role, column: c ?? 0 })} />}
      {role.from === 'preamble' && <PreambleKey label="Point key" value={role.key} keys={keys} onChange={(k) => onChange({ ...role, key: k })} />}
      {(role.from === 'column' || role.from === 'preamble') && (
        <div className="grid gap-3 sm:grid-cols-2">
          <ListField label="Values meaning the trap" value={role.trapValues} onCommit={(v) => onChange({ ...role, trapValues: v })} hint="Comma-separated; case and accents do not matter." />
          <ListField label="Values meaning the reference point" value={role.referenceValues} requireOne onCommit={(v) => onChange({ ...role, referenceValues: v })} hint="The probe on the adjacent pipe." />
        </div>
      )}
      {role.from === 'tag-pattern' && <TextField label="Pattern on the tag" value={role.pattern} mono validate={regexProblem} onCommit={(p) => onChange({ from: 'tag-pattern', pattern: p })} hint="Tags that match are reference points." />}
    </div>
  );
}

function LinkFields({ link, keys, onChange }: { link: ReferenceLink; keys: string[]; onChange: (l: ReferenceLink) => void }) {
  return (
    <div className="space-y-3">
      <Choice label="A reference reading belongs to the trap" value={link.by}
        options={[['same-tag', 'with the same tag'], ['tag-pattern', 'named by a pattern on its tag'], ['preamble', 'named in a preamble key'], ['previous-test', 'whose test comes right before it']] as const}
        onChange={(b) => onChange(b === 'tag-pattern' ? { by: 'tag-pattern', pattern: '^(?<trap>.+?)[-_ ](ref|pipe)$' } : b === 'preamble' ? { by: 'preamble', key: keys[0] ?? '' } : { by: b })} />
      {link.by === 'tag-pattern' && <TextField label="Pattern on the reference tag" value={link.pattern} mono validate={regexProblem} onCommit={(p) => onChange({ by: 'tag-pattern', pattern: p })} hint='The group named "trap" (or the first group) is the trap’s tag.' />}
      {link.by === 'preamble' && <PreambleKey label="Key naming the trap" value={link.key} keys={keys} onChange={(k) => onChange({ by: 'preamble', key: k })} />}
    </div>
  );
}

/** Columns → fields with units, and a live preview of the first normalised test. */
export function ColumnsStep({ detection, profile, onChange, uploadId, fileId, siteTimeZone }: {
  detection: LayoutDetection | null; profile: InstrumentProfile; onChange: (p: InstrumentProfile) => void; uploadId: number; fileId: number; siteTimeZone: string;
}) {
  const set = (patch: Partial<InstrumentProfile>) => onChange({ ...profile, ...patch });
  const options = columnOptions(detection, profile);
  const keys = profile.preambleKeys;
  const s = detection?.suggestedMapping ?? null;
  const [preview, setPreview] = useState<Preview | null>(null);
  const [previewError, setPreviewError] = useState<{ message: string; details: FieldIssue[] } | null>(null);
  const [loading, setLoading] = useState(false);
  // The name is asked for on the last step; the schema wants one, so the preview lends it a placeholder.
  const body = useMemo(() => JSON.stringify({ ...profile, name: profile.name.trim() || 'Draft mapping' }), [profile]);

  useEffect(() => {
    const controller = new AbortController();
    const timer = setTimeout(async () => {
      setLoading(true);
      try {
        const result = await callApi<Preview>(`/api/uploads/${uploadId}/mapping-preview`, { method: 'POST', body: { fileId, profile: JSON.parse(body) }, signal: controller.signal });
        if (result.ok) {
          setPreview(result.data);
          setPreviewError(null);
        } else {
          setPreviewError({ message: result.error.message, details: result.error.details });
        }
      } catch {
        return; // superseded by a newer edit
      }
      setLoading(false);
    }, 400);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [body, uploadId, fileId]);

  const first = preview?.tests[0];
  const levelChanged = s?.level ? !same({ column: profile.level.column, unit: profile.level.unit }, s.level.value) : false;

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <div className="space-y-4">
        <Field title="Time" note={<Confidence confidence={s?.time?.confidence ?? null} reason={s?.time?.reason} changed={!!s?.time && !same(profile.time, s.time.value)} />}>
          <TimeFields time={profile.time} options={options} keys={keys} siteTimeZone={siteTimeZone} onChange={(time) => set({ time })} />
        </Field>
        <Field title="Ultrasound level" note={<Confidence confidence={s?.level?.confidence ?? null} reason={s?.level?.reason} changed={levelChanged} />}>
          <div className="grid gap-3 sm:grid-cols-2">
            <ColumnSelect label="Level column" value={profile.level.column} options={options} onChange={(c) => set({ level: { ...profile.level, column: c ?? 0 } })} testId="setting-level-column" />
            <Choice label="Unit" value={profile.level.unit} options={LEVEL_UNITS} onChange={(u) => set({ level: { ...profile.level, unit: u } })} testId="setting-level-unit" />
            {profile.level.unit !== 'dB' && (
              <NumberField label="Reference voltage Vref (µV)" value={Math.round(profile.level.vrefV * 1e6 * 1e6) / 1e6} min={0.000001} hint="20·log10(V / Vref); 1 µV unless the meter’s manual says otherwise."
                onCommit={(v) => set({ level: { ...profile.level, vrefV: v * 1e-6 } })} />
            )}
            <NumberField label="Calibration offset (dB)" value={profile.levelOffsetDb} min={-100} max={100} hint="Added to every level." onCommit={(v) => set({ levelOffsetDb: v })} testId="setting-offset" />
          </div>
        </Field>
        <Field title="Surface temperature" note={<Confidence confidence={s?.temperature?.confidence ?? null} reason={s?.temperature?.reason} changed={!!s?.temperature && !same(profile.temperature, s.temperature.value)} />}>
          <div className="grid gap-3 sm:grid-cols-2">
            <ColumnSelect label="Temperature column" value={profile.temperature?.column ?? null} options={options} allowNone="None: the meter records no temperature"
              onChange={(c) => set({ temperature: c === null ? null : { column: c, unit: profile.temperature?.unit ?? 'C' } })} />
            {profile.temperature && <Choice label="Unit" value={profile.temperature.unit} options={TEMP_UNITS} onChange={(u) => set({ temperature: { ...profile.temperature!, unit: u } })} testId="setting-temperature-unit" />}
          </div>
        </Field>
        <Field title="Tag" note={<Confidence confidence={s?.tag?.confidence ?? null} reason={s?.tag?.reason} changed={!!s?.tag && !same(profile.tag, s.tag.value)} />}>
          <TagFields tag={profile.tag} options={options} keys={keys} onChange={(tag) => set({ tag })} />
        </Field>
        <Field title="Point role and reference readings" note={<>
          <Confidence confidence={s?.role?.confidence ?? null} reason={s?.role?.reason} changed={!!s?.role && !same(profile.role, s.role.value)} />
          {profile.role.from !== 'none' && <Confidence confidence={s?.referenceLink?.confidence ?? null} reason={s?.referenceLink?.reason} changed={!!s?.referenceLink && !same(profile.referenceLink, s.referenceLink.value)} />}
        </>}>
          <RoleFields role={profile.role} options={options} keys={keys} onChange={(role) => set({ role, ...(role.from === 'none' ? { referenceLink: { by: 'same-tag' } as const } : {}) })} />
          {profile.role.from !== 'none' && <LinkFields link={profile.referenceLink} keys={keys} onChange={(referenceLink) => set({ referenceLink })} />}
        </Field>
      </div>

      <div className="space-y-4 lg:sticky lg:top-4 lg:self-start">
        <section className="panel space-y-3 p-5" aria-labelledby="preview-heading" data-testid="mapping-preview">
          <div className="flex items-center justify-between">
            <h3 id="preview-heading" className="font-semibold">What these settings read</h3>
            <span className="text-xs text-ink-soft" aria-live="polite">{loading ? 'Reading…' : preview ? `${preview.testCount} test${preview.testCount === 1 ? '' : 's'} in this file` : ''}</span>
          </div>
          {previewError && (
            <div role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">
              <p>{previewError.message}</p>
              {previewError.details.length > 0 && <ul className="mt-1 list-disc pl-5">{previewError.details.map((d) => <li key={d.path + d.message}>{d.path}: {d.message}</li>)}</ul>}
            </div>
          )}
          {preview?.refused && <p className="text-sm text-danger-ink">The file is not read with these settings: see the problems below.</p>}
          {first ? (
            <>
              <p className="text-sm">
                First test: <span className="tag-text font-medium">{first.tag}</span> ({first.role === 'trap' ? 'trap' : `reference point${first.linkedTrapTag ? ` of ${first.linkedTrapTag}` : ''}`}),
                {' '}{new Date(first.startedAt).toLocaleString('en-GB', { timeZone: siteTimeZone, dateStyle: 'medium', timeStyle: 'medium' })} site time,
                {' '}{first.durationS.toFixed(1)} s at {first.sampleRateHz.toFixed(first.sampleRateHz < 10 ? 2 : 0)} Hz, {first.sampleCount} readings
                {first.meanLevelDb !== null ? `, mean ${first.meanLevelDb.toFixed(1)} dB` : ''}.
              </p>
              <PreviewChart series={first.series} title={`Level and temperature of the first test, ${first.tag}`} />
              {preview && preview.tests.length > 1 && (
                <ul className="text-xs text-ink-soft">
                  {preview.tests.slice(1).map((t, i) => <li key={i}>then <span className="tag-text">{t.tag}</span> ({t.role}), {t.durationS.toFixed(1)} s, {t.sampleCount} readings</li>)}
                </ul>
              )}
            </>
          ) : preview && !preview.refused ? <p className="text-sm text-ink-soft">No test read yet.</p> : null}
          {preview?.rowCounts && <p className="text-xs text-ink-soft">{Object.entries(preview.rowCounts).map(([k, v]) => `${ROW_COUNT_LABELS[k] ?? k}: ${v}`).join(' · ')}</p>}
        </section>
        {preview && preview.problems.length > 0 && (
          <section className="panel p-5">
            <h3 className="mb-2 text-sm font-semibold">Problems with these settings ({preview.problems.length}{preview.problems.length >= 50 ? '+' : ''})</h3>
            <ProblemList problems={preview.problems} testId="preview-problems" />
          </section>
        )}
      </div>
    </div>
  );
}

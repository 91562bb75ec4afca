'use client';

import { useState } from 'react';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import type { ProfileDto } from '@/lib/services/instrument-profiles';
import { callApi, type FieldIssue } from '../apiClient';
import { TextField } from './Inputs';

const ORDER_WORDS = { ymd: 'year-month-day', dmy: 'day-month-year', mdy: 'month-day-year' } as const;

function summary(p: InstrumentProfile, siteTimeZone: string): [string, string][] {
  const col = (i: number) => `column ${i + 1}${p.header[i] ? ` “${p.header[i]}”` : ''}`;
  const t = p.time;
  const zone = 'zone' in t ? (t.zone ?? `site’s zone (${siteTimeZone})`) : 'UTC';
  return [
    ['Format', `${p.encoding === 'auto' ? 'encoding recognised per file' : p.encoding}, delimiter ${p.delimiter === '\t' ? 'tab' : `“${p.delimiter}”`}, decimal ${p.decimalMark === ',' ? 'comma' : 'point'}${p.unitsRow ? ', units row' : ''}`],
    ['Time', t.kind === 'datetime' ? `${col(t.column)}${t.timeColumn !== null ? ` + ${col(t.timeColumn)}` : ''}, ${ORDER_WORDS[t.order]}, ${zone}` : t.kind === 'epoch' ? `${col(t.column)}, epoch ${t.unit}` : t.kind === 'elapsed' ? `${col(t.column)} in ${t.unit} from “${t.startKey}”, ${zone}` : `${t.column === null ? 'row order' : col(t.column)} at ${t.rateHz ? `${t.rateHz} Hz` : `“${t.rateKey}”`} from “${t.startKey}”`],
    ['Level', `${col(p.level.column)} in ${p.level.unit}${p.level.unit === 'dB' ? '' : `, Vref ${p.level.vrefV * 1e6} µV`}${p.levelOffsetDb ? `, offset ${p.levelOffsetDb} dB` : ''}`],
    ['Temperature', p.temperature ? `${col(p.temperature.column)} in ${p.temperature.unit === 'K' ? 'K' : `°${p.temperature.unit}`}` : 'none'],
    ['Tag', p.tag.from === 'column' ? col(p.tag.column) : p.tag.from === 'file-name' ? `file name, pattern ${p.tag.pattern}` : `preamble “${p.tag.key}”`],
    ['Point role', p.role.from === 'none' ? 'every test is on a trap' : p.role.from === 'column' ? `${col(p.role.column)}: reference = ${p.role.referenceValues.join(', ')}` : p.role.from === 'preamble' ? `preamble “${p.role.key}”` : `tags matching ${p.role.pattern}`],
    ['Reference link', p.role.from === 'none' ? '—' : p.referenceLink.by === 'same-tag' ? 'same tag' : p.referenceLink.by === 'previous-test' ? 'the trap test before it' : p.referenceLink.by === 'preamble' ? `preamble “${p.referenceLink.key}”` : `pattern ${p.referenceLink.pattern}`],
  ];
}

/** Name the profile, save it, and read the upload's files of this layout with it. */
export function SaveStep({ profile, onChange, uploadId, fingerprint, onSaved, siteTimeZone }: {
  profile: InstrumentProfile; onChange: (p: InstrumentProfile) => void; uploadId: number; fingerprint: string; onSaved: () => void; siteTimeZone: string;
}) {
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  const nameIssue = issues.find((i) => i.path === 'name' || i.path === 'definition.name')?.message;

  async function save(event: React.FormEvent) {
    event.preventDefault();
    const name = profile.name.trim();
    if (!name) {
      setIssues([{ path: 'name', message: 'Name the meter model, e.g. "Model B day file, firmware 2".' }]);
      return;
    }
    setBusy(true);
    setMessage(null);
    setIssues([]);
    const created = await callApi<ProfileDto>('/api/instrument-profiles', { method: 'POST', body: { name, fingerprint, definition: { ...profile, name, fingerprint } } });
    if (!created.ok) {
      setBusy(false);
      setMessage(created.error.message);
      setIssues(created.error.details);
      return;
    }
    const applied = await callApi(`/api/uploads/${uploadId}/apply-profile`, { method: 'POST', body: { profileId: created.data.id, reprocess: false } });
    setBusy(false);
    if (!applied.ok) {
      setMessage(`The profile “${name}” is saved, but the files could not be queued: ${applied.error.message}`);
      return;
    }
    onSaved();
  }

  return (
    <form className="grid gap-5 lg:grid-cols-2" onSubmit={save} noValidate>
      <section className="panel space-y-4 p-5">
        <div>
          <TextField label="Profile name" value={profile.name} placeholder="Meter model and firmware, e.g. Model B day file" onCommit={(name) => onChange({ ...profile, name })} testId="profile-name" />
          {nameIssue && <p className="field-error">{nameIssue}</p>}
        </div>
        <label className="block">
          <span className="field-label">Notes (optional)</span>
          <textarea className="field-input min-h-20" value={profile.description} maxLength={2000} onChange={(e) => onChange({ ...profile, description: e.target.value })} />
        </label>
        <p className="text-sm text-ink-soft">
          Saving keeps this mapping as an instrument profile for every site, recognised by the layout’s header fingerprint
          <span className="tag-text"> {fingerprint}</span>, and reads this upload’s files of the layout with it. Later uploads of the layout are read without the wizard.
        </p>
        {message && (
          <div role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">
            <p>{message}</p>
            {issues.filter((i) => i.path !== 'name').length > 0 && <ul className="mt-1 list-disc pl-5">{issues.filter((i) => i.path !== 'name').map((i) => <li key={i.path + i.message}>{i.path}: {i.message}</li>)}</ul>}
          </div>
        )}
        <button type="submit" className="btn-primary" disabled={busy}>{busy ? 'Saving…' : 'Save profile and read the files'}</button>
      </section>
      <section className="panel p-5">
        <h3 className="mb-2 text-sm font-semibold">The mapping</h3>
        <dl className="space-y-1.5 text-sm">
          {summary(profile, siteTimeZone).map(([k, v]) => (
            <div key={k} className="grid grid-cols-[8rem_1fr] gap-2 border-b border-line pb-1.5"><dt className="text-ink-soft">{k}</dt><dd className="break-words">{v}</dd></div>
          ))}
        </dl>
      </section>
    </form>
  );
}

'use client';

import Link from 'next/link';
import { useState } from 'react';
import { TRAP_TYPES, TRAP_TYPE_LABELS, type TrapType } from '@/lib/domain/vocabulary';
import type { TrapDto } from '@/lib/services/dto';
import type { UploadDetail } from '@/lib/services/uploads';
import { trapInputSchema } from '@/lib/validation/trap';
import { callApi, uploadPath } from './apiClient';
import { usePolling } from './usePolling';

type Unmatched = UploadDetail['unmatchedTags'][number];
type Mode = 'create' | 'map' | 'ignore';

/** Each tag the register does not know: add it as a trap, match it to a trap, or ignore its tests. */
export function TagDecisions({ siteId, uploadId, areas }: { siteId: number; uploadId: number; areas: { id: number; name: string }[] }) {
  const { data: upload, error, reload } = usePolling<UploadDetail>(`/api/uploads/${uploadId}`, () => false);
  const [done, setDone] = useState<string[]>([]);
  if (error) return <p role="alert" className="text-sm text-danger-ink">{error.message}</p>;
  if (!upload) return <p className="text-sm text-ink-soft">Loading…</p>;
  return (
    <div className="space-y-4">
      <div>
        <Link href={uploadPath(siteId, uploadId)} className="text-sm text-ink-soft hover:underline">← Upload #{uploadId}</Link>
        <h2 className="text-lg font-semibold">Match tags to the register</h2>
        <p className="text-sm text-ink-soft">Tests of these tags are held back. A tag added or matched here has its tests measured with the trap’s type and pressure; an ignored tag’s tests stay out of the survey.</p>
      </div>
      {done.length > 0 && <p role="status" className="text-sm">Decided: {done.join(', ')}.</p>}
      {upload.unmatchedTags.length === 0 ? (
        <p className="panel p-5 text-sm">Every tag of this upload is in the register or ignored. <Link href={uploadPath(siteId, uploadId)} className="text-accent-700 hover:underline">Back to the upload</Link></p>
      ) : (
        <ul className="space-y-3" data-testid="tag-decisions">
          {upload.unmatchedTags.map((t) => (
            <TagRow key={t.tag} siteId={siteId} uploadId={uploadId} unmatched={t} areas={areas} onDecided={(label) => { setDone((d) => [...d, label]); reload(); }} />
          ))}
        </ul>
      )}
    </div>
  );
}

function TagRow({ siteId, uploadId, unmatched, areas, onDecided }: { siteId: number; uploadId: number; unmatched: Unmatched; areas: { id: number; name: string }[]; onDecided: (label: string) => void }) {
  const [mode, setMode] = useState<Mode>('create');
  const [trapType, setTrapType] = useState<TrapType | ''>('');
  const [pressure, setPressure] = useState('');
  const [areaId, setAreaId] = useState('');
  const [query, setQuery] = useState(unmatched.tag.slice(0, Math.max(3, unmatched.tag.lastIndexOf('-'))));
  const [found, setFound] = useState<TrapDto[] | null>(null);
  const [trapId, setTrapId] = useState<number | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function search() {
    const r = await callApi<{ items: TrapDto[] }>(`/api/sites/${siteId}/traps?q=${encodeURIComponent(query.trim())}&pageSize=10`);
    setFound(r.ok ? r.data.items : []);
    if (!r.ok) setMessage(r.error.message);
  }

  async function decide() {
    setErrors({});
    setMessage(null);
    let body: unknown;
    if (mode === 'create') {
      const parsed = trapInputSchema.safeParse({ tag: unmatched.tag, trapType: trapType || undefined, pressureBarg: pressure.trim() === '' ? undefined : Number(pressure.replace(',', '.')), areaId: areaId ? Number(areaId) : null });
      if (!parsed.success) {
        const e: Record<string, string> = {};
        for (const issue of parsed.error.issues) e[String(issue.path[0])] ??= issue.message;
        setErrors(e);
        return;
      }
      const { tag: _tag, ...trap } = parsed.data;
      body = { tag: unmatched.tag, action: 'create', trap };
    } else if (mode === 'map') {
      if (!trapId) return setErrors({ trapId: 'Choose the trap these tests belong to.' });
      body = { tag: unmatched.tag, action: 'map', trapId };
    } else body = { tag: unmatched.tag, action: 'ignore' };
    setBusy(true);
    const r = await callApi(`/api/uploads/${uploadId}/tags`, { method: 'POST', body });
    setBusy(false);
    if (!r.ok) {
      setMessage(r.error.message);
      const e: Record<string, string> = {};
      for (const d of r.error.details) e[d.path.split('.').pop() ?? ''] ??= d.message;
      setErrors(e);
      return;
    }
    onDecided(`${unmatched.tag} ${mode === 'create' ? 'added to the register' : mode === 'map' ? 'matched' : 'ignored'}`);
  }

  return (
    <li className="panel space-y-3 p-4" data-testid="tag-row">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <span className="tag-text text-base font-semibold">{unmatched.tag}</span>
          <span className="ml-2 text-sm text-ink-soft">{unmatched.tests} test{unmatched.tests === 1 ? '' : 's'} ({unmatched.roles.map((r) => (r === 'trap' ? 'trap point' : 'reference point')).join(', ')})</span>
        </div>
        <div role="radiogroup" aria-label={`What to do with ${unmatched.tag}`} className="flex gap-3 text-sm">
          {([['create', 'Add as a new trap'], ['map', 'Same as a trap in the register'], ['ignore', 'Ignore its tests']] as const).map(([m, label]) => (
            <label key={m} className="flex items-center gap-1.5"><input type="radio" name={`mode-${unmatched.tag}`} checked={mode === m} onChange={() => setMode(m)} />{label}</label>
          ))}
        </div>
      </div>
      {mode === 'create' && (
        <div className="grid gap-3 sm:grid-cols-3">
          <label className="block">
            <span className="field-label">Trap type</span>
            <select className="field-input" value={trapType} onChange={(e) => setTrapType(e.target.value as TrapType)}>
              <option value="">Choose…</option>
              {TRAP_TYPES.map((t) => <option key={t} value={t}>{TRAP_TYPE_LABELS[t]}</option>)}
            </select>
            {errors.trapType && <p className="field-error">{errors.trapType}</p>}
          </label>
          <label className="block">
            <span className="field-label">Line pressure (barg)</span>
            <input className="field-input" inputMode="decimal" value={pressure} onChange={(e) => setPressure(e.target.value)} />
            {errors.pressureBarg && <p className="field-error">{errors.pressureBarg}</p>}
          </label>
          <label className="block">
            <span className="field-label">Area (optional)</span>
            <select className="field-input" value={areaId} onChange={(e) => setAreaId(e.target.value)}>
              <option value="">No area yet</option>
              {areas.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
            </select>
          </label>
          {errors.tag && <p className="field-error sm:col-span-3">{errors.tag}</p>}
        </div>
      )}
      {mode === 'map' && (
        <div className="space-y-2">
          <div className="flex items-end gap-2">
            <label className="block flex-1">
              <span className="field-label">Search the register</span>
              <input className="field-input" value={query} onChange={(e) => setQuery(e.target.value)} onKeyDown={(e) => { if (e.key === 'Enter') { e.preventDefault(); void search(); } }} />
            </label>
            <button type="button" className="btn-quiet" onClick={search}>Search</button>
          </div>
          {found && found.length === 0 && <p className="text-sm text-ink-soft">No trap matches “{query}”.</p>}
          {found && found.length > 0 && (
            <ul className="divide-y divide-line rounded-md border border-line text-sm">
              {found.map((t) => (
                <li key={t.id}>
                  <label className="flex items-center gap-2 px-3 py-1.5">
                    <input type="radio" name={`trap-${unmatched.tag}`} checked={trapId === t.id} onChange={() => setTrapId(t.id)} />
                    <span className="tag-text">{t.tag}</span><span className="text-ink-soft">{t.areaName ?? ''} · {TRAP_TYPE_LABELS[t.trapType]} · {t.pressureBarg} barg</span>
                  </label>
                </li>
              ))}
            </ul>
          )}
          {errors.trapId && <p className="field-error">{errors.trapId}</p>}
        </div>
      )}
      {mode === 'ignore' && <p className="text-sm text-ink-soft">Its tests stay stored with the upload but count in no survey figure.</p>}
      {message && <p role="alert" className="text-sm text-danger-ink">{message}</p>}
      <button type="button" className="btn-primary" disabled={busy} onClick={decide}>{busy ? 'Saving…' : mode === 'create' ? 'Add trap' : mode === 'map' ? 'Match' : 'Ignore'}</button>
    </li>
  );
}

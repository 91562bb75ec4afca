'use client';

import { useState } from 'react';
import type { SourceFileDto } from '@/lib/services/uploads';
import { callApi } from './apiClient';

/**
 * Reading files again with the current revision of a profile: never automatic after an edit,
 * always this explicit, confirmed action (the tests of those files are replaced).
 */
export function ReprocessPanel({ uploadId, profiles, files, onDone }: {
  uploadId: number; profiles: { id: number; name: string; revision: number | null }[]; files: SourceFileDto[]; onDone: () => void;
}) {
  const [profileId, setProfileId] = useState(profiles[0]?.id ?? 0);
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const chosen = profiles.find((p) => p.id === profileId);
  const affected = files.filter((f) => f.profileId === profileId && f.kind !== 'zip');
  const stale = chosen?.revision !== null ? affected.filter((f) => f.profileRevision !== chosen?.revision).length : 0;

  async function run() {
    setBusy(true);
    const result = await callApi(`/api/uploads/${uploadId}/apply-profile`, { method: 'POST', body: { profileId, reprocess: true } });
    setBusy(false);
    setConfirming(false);
    setMessage(result.ok ? 'Queued: the files are read again with the profile as it is now.' : result.error.message);
    if (result.ok) onDone();
  }

  return (
    <section className="panel space-y-3 p-5" aria-labelledby="reprocess-heading">
      <h3 id="reprocess-heading" className="font-semibold">Read again with an edited profile</h3>
      <p className="text-sm text-ink-soft">
        Editing an instrument profile never changes what was imported with it. To apply an edit to this upload, read its files again:
        their tests are replaced by what the profile reads now.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <label className="block">
          <span className="field-label">Profile</span>
          <select className="field-input" value={profileId} onChange={(e) => { setProfileId(Number(e.target.value)); setConfirming(false); }}>
            {profiles.map((p) => <option key={p.id} value={p.id}>{p.name}{p.revision ? ` (rev. ${p.revision})` : ''}</option>)}
          </select>
        </label>
        {!confirming && <button type="button" className="btn-quiet" onClick={() => setConfirming(true)} disabled={affected.length === 0}>Re-process {affected.length} file{affected.length === 1 ? '' : 's'}…</button>}
      </div>
      {stale > 0 && <p className="text-sm text-ink-soft">{stale} of these files were read with an older revision.</p>}
      {confirming && (
        <div role="alertdialog" aria-label="Confirm re-processing" className="space-y-2 rounded-md border border-caution-line bg-caution-bg p-3 text-sm text-caution-ink">
          <p>Read {affected.length} file{affected.length === 1 ? '' : 's'} again with “{chosen?.name}”{chosen?.revision ? `, revision ${chosen.revision}` : ''}? Their current tests are replaced; verdicts already confirmed on them need reviewing again.</p>
          <div className="flex gap-2">
            <button type="button" className="btn-primary" onClick={run} disabled={busy}>{busy ? 'Queuing…' : 'Yes, re-process'}</button>
            <button type="button" className="btn-quiet" onClick={() => setConfirming(false)} disabled={busy}>Cancel</button>
          </div>
        </div>
      )}
      {message && <p role="status" className="text-sm">{message}</p>}
    </section>
  );
}

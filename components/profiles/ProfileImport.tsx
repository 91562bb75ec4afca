'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { ProfileDto } from '@/lib/services/instrument-profiles';
import { callApi, type FieldIssue } from '@/components/uploads/apiClient';

/**
 * Imports a profile file exported from this or another installation. The server checks it with
 * the same schema it uses for every profile and names each field that does not fit.
 */
export function ProfileImport() {
  const router = useRouter();
  const [fileName, setFileName] = useState<string | null>(null);
  const [definition, setDefinition] = useState<Record<string, unknown> | null>(null);
  const [name, setName] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  const [busy, setBusy] = useState(false);

  async function choose(file: File | undefined) {
    setMessage(null);
    setIssues([]);
    setDefinition(null);
    if (!file) return;
    setFileName(file.name);
    try {
      const value = JSON.parse(await file.text());
      if (!value || typeof value !== 'object' || Array.isArray(value)) throw new Error('the file holds no JSON object');
      setDefinition(value);
      setName(typeof value.name === 'string' ? value.name : '');
    } catch (err) {
      setMessage(`${file.name} is not a profile file: ${(err as Error).message}. Export one from the instrument profiles page.`);
    }
  }

  async function save() {
    if (!definition) return;
    setBusy(true);
    const r = await callApi<ProfileDto>('/api/instrument-profiles', { method: 'POST', body: { name: name.trim(), definition: { ...definition, name: name.trim() || definition.name } } });
    setBusy(false);
    if (!r.ok) {
      setMessage(r.error.message);
      setIssues(r.error.details);
      return;
    }
    router.push(`/instrument-profiles/${r.data.id}`);
    router.refresh();
  }

  return (
    <section className="panel space-y-3 p-5" aria-labelledby="import-heading">
      <h2 id="import-heading" className="font-semibold">Import a profile file</h2>
      <p className="text-sm text-ink-soft">A profile exported as JSON from Plumeward (format <code className="tag-text">plumeward.instrument-profile</code>, version 1), to share a meter model’s mapping between installations.</p>
      <label className="block">
        <span className="field-label">Profile file (.json)</span>
        <input type="file" accept=".json,application/json" className="mt-1 block text-sm" onChange={(e) => choose(e.target.files?.[0])} data-testid="profile-file" />
      </label>
      {definition && (
        <div className="flex flex-wrap items-end gap-3">
          <label className="block min-w-72">
            <span className="field-label">Name</span>
            <input className="field-input" value={name} onChange={(e) => setName(e.target.value)} />
          </label>
          <button type="button" className="btn-primary" disabled={busy} onClick={save}>{busy ? 'Checking…' : `Import ${fileName}`}</button>
        </div>
      )}
      {message && (
        <div role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink" data-testid="import-errors">
          <p>{message}</p>
          {issues.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {issues.map((i) => <li key={i.path + i.message}><span className="tag-text">{i.path.replace(/^definition\.?/, '') || '(file)'}</span>: {i.message}</li>)}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}

'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { ProfileDto } from '@/lib/services/instrument-profiles';
import { callApi, type FieldIssue } from '@/components/uploads/apiClient';

function slug(name: string) {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'profile';
}

/** Export as a JSON file; for admins and analysts, edit the name and the definition. */
export function ProfileEditor({ profile, canWrite }: { profile: ProfileDto; canWrite: boolean }) {
  const router = useRouter();
  const json = JSON.stringify(profile.definition, null, 2);
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState(profile.name);
  const [text, setText] = useState(json);
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  const [busy, setBusy] = useState(false);
  const [saved, setSaved] = useState(false);

  function exportFile() {
    const blob = new Blob([`${json}\n`], { type: 'application/json' });
    const url = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = url;
    a.download = `${slug(profile.name)}.profile.json`;
    document.body.appendChild(a);
    a.click();
    a.remove();
    URL.revokeObjectURL(url);
  }

  async function save() {
    setMessage(null);
    setIssues([]);
    setSaved(false);
    let definition: unknown;
    try {
      definition = JSON.parse(text);
    } catch (err) {
      setMessage(`The definition is not valid JSON: ${(err as Error).message}`);
      return;
    }
    setBusy(true);
    const r = await callApi<ProfileDto>(`/api/instrument-profiles/${profile.id}`, { method: 'PATCH', body: { name: name.trim(), definition: { ...(definition as object), name: name.trim() } } });
    setBusy(false);
    if (!r.ok) {
      setMessage(r.error.message);
      setIssues(r.error.details);
      return;
    }
    setEditing(false);
    setSaved(true);
    router.refresh();
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-quiet" onClick={exportFile} data-testid="export-profile">Export as JSON file</button>
        {canWrite && !editing && <button type="button" className="btn-quiet" onClick={() => { setEditing(true); setText(json); setName(profile.name); }}>Edit</button>}
      </div>
      {saved && <p role="status" className="text-sm">Saved as revision {profile.revision}. Uploads read before keep what they read; re-process them from their upload page to apply this edit.</p>}
      {editing ? (
        <section className="panel space-y-3 p-5">
          <p role="note" className="rounded-md border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution-ink">
            An edit makes a new revision and applies to files read from now on. Tests already imported with this profile stay as they were read:
            to apply the edit to an upload, open it and choose “Re-process”.
          </p>
          <label className="block">
            <span className="field-label">Name</span>
            <input className="field-input" value={name} onChange={(e) => setName(e.target.value)} />
          </label>
          <label className="block">
            <span className="field-label">Definition (JSON)</span>
            <textarea className="field-input tag-text min-h-96" spellCheck={false} value={text} onChange={(e) => setText(e.target.value)} />
          </label>
          {message && (
            <div role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">
              <p>{message}</p>
              {issues.length > 0 && <ul className="mt-1 list-disc pl-5">{issues.map((i) => <li key={i.path + i.message}><span className="tag-text">{i.path}</span>: {i.message}</li>)}</ul>}
            </div>
          )}
          <div className="flex gap-2">
            <button type="button" className="btn-primary" disabled={busy} onClick={save}>{busy ? 'Saving…' : 'Save a new revision'}</button>
            <button type="button" className="btn-quiet" disabled={busy} onClick={() => { setEditing(false); setMessage(null); setIssues([]); }}>Cancel</button>
          </div>
        </section>
      ) : (
        <section className="panel p-5">
          <h3 className="mb-2 text-sm font-semibold">Definition</h3>
          <pre className="tag-text max-h-[32rem] overflow-auto rounded-md bg-surface-sunken p-3 text-xs" data-testid="profile-definition">{json}</pre>
        </section>
      )}
    </div>
  );
}

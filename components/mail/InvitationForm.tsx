'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { callApi } from '@/components/uploads/apiClient';
import { ROLES, ROLE_LABELS } from '@/lib/domain/vocabulary';

/** Invite a user by e-mail: they choose their own password through a single-use link. */
export function InvitationForm({ sites }: { sites: { id: number; name: string }[] }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formEl = event.currentTarget;
    const f = new FormData(formEl);
    setBusy(true);
    const res = await callApi<{ email: string; expiresAt: string; mailed?: boolean }>('/api/invitations', {
      method: 'POST', body: { name: f.get('name'), email: f.get('email'), role: f.get('role'), siteIds: f.getAll('siteIds').map(Number) },
    });
    setBusy(false);
    if (!res.ok) {
      setErrors(Object.fromEntries(res.error.details.map((d) => [d.path, d.message])));
      setMessage({ ok: false, text: res.error.message });
      return;
    }
    setErrors({});
    formEl.reset();
    setMessage({ ok: true, text: `Invitation sent to ${res.data.email}; the link works once, until ${res.data.expiresAt.replace('T', ' ').slice(0, 16)} UTC.${res.data.mailed === false ? ' The mail could not be sent: check SMTP_URL.' : ''}` });
    router.refresh();
  }
  return (
    <form onSubmit={submit} className="panel grid gap-3 p-4 md:grid-cols-2" noValidate data-testid="invite-form">
      <div className="md:col-span-2">
        <h2 className="font-semibold">Invite by e-mail</h2>
        <p className="text-xs text-ink-faint">The invitee gets a single-use link, valid for 72 hours, and chooses a password. No password changes hands.</p>
      </div>
      <label><span className="field-label">Name</span><input name="name" className="field-input" />{errors.name && <span className="field-error">{errors.name}</span>}</label>
      <label><span className="field-label">E-mail</span><input name="email" type="email" className="field-input" />{errors.email && <span className="field-error">{errors.email}</span>}</label>
      <label><span className="field-label">Role</span><select name="role" className="field-input" defaultValue="technician">{ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}</select></label>
      <fieldset className="flex flex-wrap items-end gap-3 text-sm"><legend className="field-label">Sites</legend>
        {sites.map((s) => <label key={s.id} className="flex items-center gap-1"><input type="checkbox" name="siteIds" value={s.id} />{s.name}</label>)}
        {errors.siteIds && <span className="field-error">{errors.siteIds}</span>}
      </fieldset>
      <div className="flex items-center gap-3 md:col-span-2">
        <button type="submit" className="btn-primary" disabled={busy}>Send invitation</button>
        {message && <p role={message.ok ? 'status' : 'alert'} className={`text-sm ${message.ok ? 'text-accent-700' : 'text-danger-ink'}`}>{message.text}</p>}
      </div>
    </form>
  );
}

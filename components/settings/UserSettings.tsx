'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormError } from '@/components/FormError';
import { InvitationForm } from '@/components/mail/InvitationForm';
import { useActionForm } from '@/components/useActionForm';
import { createUserAction, updateUserAction } from '@/lib/actions/settings';
import { ROLES, ROLE_LABELS } from '@/lib/domain/vocabulary';
import type { UserDto } from '@/lib/services/dto';

type Site = { id: number; name: string };

function checkedSites(form: FormData) {
  return form.getAll('siteIds').map(Number);
}

function UserRow({ user, sites, selfId }: { user: UserDto; sites: Site[]; selfId: number }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function update(changes: Record<string, unknown>) {
    const result = await updateUserAction({ userId: user.id, user: changes });
    if (!result.ok) {
      setError(result.error.message);
      return false;
    }
    setError(null);
    router.refresh();
    return true;
  }
  async function save(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const password = String(f.get('password') ?? '');
    if (await update({ role: f.get('role'), siteIds: checkedSites(f), ...(password ? { password } : {}) })) setEditing(false);
  }
  const siteNames = user.role === 'admin' ? 'All sites' : sites.filter((s) => user.siteIds.includes(s.id)).map((s) => s.name).join(', ') || 'No site';
  return (
    <tr data-testid={`user-${user.email}`}>
      <td><div className="font-medium">{user.name}</div><div className="text-xs text-ink-soft">{user.email}</div></td>
      {editing ? (
        <td colSpan={3}>
          <form method="post" onSubmit={save} className="space-y-2">
            <select name="role" defaultValue={user.role} className="field-input w-48" aria-label="Role">{ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}</select>
            <fieldset className="flex flex-wrap gap-3 text-sm"><legend className="field-label">Sites</legend>
              {sites.map((s) => <label key={s.id} className="flex items-center gap-1"><input type="checkbox" name="siteIds" value={s.id} defaultChecked={user.siteIds.includes(s.id)} />{s.name}</label>)}
            </fieldset>
            <input name="password" type="password" className="field-input w-64" placeholder="New password (optional)" autoComplete="new-password" />
            <div className="flex gap-2"><SubmitButton className="btn-primary">Save</SubmitButton><button className="btn-quiet" type="button" onClick={() => setEditing(false)}>Cancel</button></div>
            {error && <p className="field-error" role="alert">{error}</p>}
          </form>
        </td>
      ) : (
        <>
          <td>{ROLE_LABELS[user.role]}</td>
          <td className="text-ink-soft">{siteNames}</td>
          <td>{user.status === 'active' ? '● Active' : '○ Disabled'}{error && <p className="field-error" role="alert">{error}</p>}</td>
        </>
      )}
      <td className="space-x-3 text-right text-sm">
        {!editing && <button type="button" className="text-accent-700 hover:underline" onClick={() => setEditing(true)}>Edit</button>}
        {!editing && user.id !== selfId && (
          <button type="button" className="text-accent-700 hover:underline" onClick={() => update({ status: user.status === 'active' ? 'disabled' : 'active' })}>
            {user.status === 'active' ? 'Disable' : 'Enable'}
          </button>
        )}
      </td>
    </tr>
  );
}

export function UserSettings({ users, sites, selfId }: { users: UserDto[]; sites: Site[]; selfId: number }) {
  const { handler, message, issues, errors } = useActionForm();
  const onSubmit = handler((f) => createUserAction({ email: f.get('email'), name: f.get('name'), role: f.get('role'), password: f.get('password'), siteIds: checkedSites(f) }));
  return (
    <div className="space-y-4">
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>User</th><th>Role</th><th>Sites</th><th>Status</th><th /></tr></thead>
          <tbody>{users.map((u) => <UserRow key={u.id} user={u} sites={sites} selfId={selfId} />)}</tbody>
        </table>
      </div>
      <InvitationForm sites={sites} />
      <p className="text-xs text-ink-faint">A disabled user is refused on their very next request, and a changed role or site list applies at once: every request re-reads them.</p>
      <form method="post" onSubmit={onSubmit} className="panel grid gap-3 p-4 md:grid-cols-2" noValidate>
        <h2 className="font-semibold md:col-span-2">New user</h2>
        <label><span className="field-label">Name</span><input name="name" className="field-input" />{errors.name && <span className="field-error">{errors.name}</span>}</label>
        <label><span className="field-label">E-mail</span><input name="email" type="email" className="field-input" />{errors.email && <span className="field-error">{errors.email}</span>}</label>
        <label><span className="field-label">Role</span><select name="role" className="field-input" defaultValue="viewer">{ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}</select></label>
        <label><span className="field-label">Initial password</span><input name="password" type="password" className="field-input" autoComplete="new-password" />{errors.password && <span className="field-error">{errors.password}</span>}</label>
        <fieldset className="flex flex-wrap gap-3 text-sm md:col-span-2"><legend className="field-label">Sites</legend>
          {sites.map((s) => <label key={s.id} className="flex items-center gap-1"><input type="checkbox" name="siteIds" value={s.id} />{s.name}</label>)}
        </fieldset>
        <div className="flex items-center gap-3 md:col-span-2"><SubmitButton className="btn-primary">Create user</SubmitButton><FormError message={message} issues={issues} fields={['name', 'email', 'role', 'password', 'siteIds']} /></div>
      </form>
    </div>
  );
}

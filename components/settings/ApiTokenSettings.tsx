'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormError } from '@/components/FormError';
import { useActionForm } from '@/components/useActionForm';
import { createApiTokenAction, revokeApiTokenAction } from '@/lib/actions/settings';
import type { ApiTokenDto } from '@/lib/services/api-tokens';

type Named = { id: number; name: string };

export function ApiTokenSettings({ tokens, users, sites }: { tokens: ApiTokenDto[]; users: Named[]; sites: Named[] }) {
  const router = useRouter();
  const [secret, setSecret] = useState<string | null>(null);
  const { handler, fail, message, issues, errors } = useActionForm();
  const onSubmit = handler(
    (f) => createApiTokenAction({
      name: f.get('name'), userId: Number(f.get('userId')), readOnly: f.get('readOnly') === 'on', siteIds: f.getAll('siteIds').map(Number),
    }),
    (token) => setSecret(token.secret),
  );
  async function revoke(tokenId: number) {
    const result = await revokeApiTokenAction({ tokenId });
    if (!result.ok) fail(result.error.message);
    router.refresh();
  }
  const siteName = (id: number) => sites.find((s) => s.id === id)?.name ?? `site ${id}`;
  return (
    <div className="space-y-4">
      {secret && (
        <div role="status" className="rounded-lg border border-accent-200 bg-accent-50 p-4 text-sm">
          <p className="font-semibold">Copy this token now: it is shown only once and stored only as a hash.</p>
          <code className="mt-2 block break-all rounded bg-surface-raised px-2 py-1 tag-text" data-testid="new-token">{secret}</code>
          <p className="mt-2 text-ink-soft">Scripts send it as <code className="tag-text">Authorization: Bearer {'<token>'}</code>.</p>
        </div>
      )}
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>Token</th><th>Owner</th><th>Scope</th><th>Last used</th><th>Status</th><th /></tr></thead>
          <tbody>
            {tokens.map((t) => (
              <tr key={t.id}>
                <td><div className="font-medium">{t.name}</div><div className="tag-text text-xs text-ink-soft">{t.prefix}…</div></td>
                <td>{t.userName}</td>
                <td className="text-ink-soft">{t.readOnly ? 'Read-only' : 'Read and write'} · {t.siteIds ? t.siteIds.map(siteName).join(', ') : "all the owner's sites"}</td>
                <td className="text-ink-soft">{t.lastUsedAt ? t.lastUsedAt.slice(0, 16).replace('T', ' ') : 'never'}</td>
                <td>{t.revokedAt ? '○ Revoked' : '● Active'}</td>
                <td className="text-right">{!t.revokedAt && <button type="button" className="text-sm text-danger-ink hover:underline" onClick={() => revoke(t.id)}>Revoke</button>}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <form method="post" onSubmit={onSubmit} className="panel grid gap-3 p-4 md:grid-cols-2" noValidate>
        <h2 className="font-semibold md:col-span-2">New API token</h2>
        <label><span className="field-label">Name</span><input name="name" className="field-input" placeholder="e.g. nightly export script" />{errors.name && <span className="field-error">{errors.name}</span>}</label>
        <label><span className="field-label">Owner</span><select name="userId" className="field-input">{users.map((u) => <option key={u.id} value={u.id}>{u.name}</option>)}</select></label>
        <fieldset className="flex flex-wrap gap-3 text-sm"><legend className="field-label">Limit to sites (none ticked: all the owner&apos;s sites)</legend>
          {sites.map((s) => <label key={s.id} className="flex items-center gap-1"><input type="checkbox" name="siteIds" value={s.id} />{s.name}</label>)}
        </fieldset>
        <label className="flex items-center gap-2 text-sm"><input type="checkbox" name="readOnly" /> Read-only</label>
        <div className="flex items-center gap-3 md:col-span-2"><SubmitButton className="btn-primary">Create token</SubmitButton><FormError message={message} issues={issues} fields={['name']} /></div>
      </form>
    </div>
  );
}

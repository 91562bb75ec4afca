'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormError, issuesByField } from '@/components/FormError';
import { useActionForm } from '@/components/useActionForm';
import { createAreaAction, updateAreaAction } from '@/lib/actions/register';
import type { FieldIssue } from '@/lib/http/zod-issues';

type Area = { id: number; name: string; description: string | null; trapCount: number };

function AreaRow({ area, canEdit }: { area: Area; canEdit: boolean }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function save(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const result = await updateAreaAction({ areaId: area.id, area: { name: form.get('name'), description: form.get('description') } });
    if (!result.ok) return setError(issuesByField(result.error.details as FieldIssue[]).name ?? result.error.message);
    setEditing(false);
    setError(null);
    router.refresh();
  }
  if (editing) {
    return (
      <tr>
        <td colSpan={4}>
          <form method="post" onSubmit={save} className="flex flex-wrap items-end gap-2">
            <label className="flex-1"><span className="field-label">Name</span><input name="name" defaultValue={area.name} className="field-input" /></label>
            <label className="flex-[2]"><span className="field-label">Description</span><input name="description" defaultValue={area.description ?? ''} className="field-input" /></label>
            <SubmitButton className="btn-primary">Save</SubmitButton>
            <button className="btn-quiet" type="button" onClick={() => setEditing(false)}>Cancel</button>
            {error && <p className="field-error w-full" role="alert">{error}</p>}
          </form>
        </td>
      </tr>
    );
  }
  return (
    <tr>
      <td className="font-medium">{area.name}</td>
      <td className="text-ink-soft">{area.description}</td>
      <td className="text-right">{area.trapCount}</td>
      <td className="text-right">{canEdit && <button type="button" className="text-sm text-accent-700 hover:underline" onClick={() => setEditing(true)}>Rename</button>}</td>
    </tr>
  );
}

export function AreaManager({ siteId, areas, canEdit }: { siteId: number; areas: Area[]; canEdit: boolean }) {
  const { handler, message, issues, errors } = useActionForm();
  const add = handler((form) => createAreaAction({ siteId, area: { name: form.get('name'), description: form.get('description') } }));
  return (
    <div className="space-y-4">
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>Area</th><th>Description</th><th className="text-right">Traps</th><th /></tr></thead>
          <tbody>{areas.map((a) => <AreaRow key={a.id} area={a} canEdit={canEdit} />)}</tbody>
        </table>
      </div>
      {canEdit && (
        <form method="post" onSubmit={add} className="panel flex flex-wrap items-end gap-3 p-4" noValidate>
          <label className="flex-1"><span className="field-label">New area</span><input name="name" className="field-input" placeholder="e.g. Condensate Return Station" />{errors.name && <span className="field-error">{errors.name}</span>}</label>
          <label className="flex-[2]"><span className="field-label">Description</span><input name="description" className="field-input" /></label>
          <SubmitButton className="btn-primary">Add area</SubmitButton>
          <div className="w-full"><FormError message={message} issues={issues} fields={['name', 'description']} /></div>
        </form>
      )}
    </div>
  );
}

'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormError, issuesByField } from '@/components/FormError';
import { createSurveyAction } from '@/lib/actions/register';
import type { FieldIssue } from '@/lib/http/zod-issues';

export function SurveyForm({ siteId }: { siteId: number }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    const result = await createSurveyAction({
      siteId,
      survey: { name: form.get('name'), startsOn: form.get('startsOn'), endsOn: form.get('endsOn'), status: form.get('status') },
    });
    if (!result.ok) {
      setMessage(result.error.message);
      setIssues((result.error.details as FieldIssue[]) ?? []);
      return;
    }
    formElement.reset();
    setMessage(null);
    setIssues([]);
    router.refresh();
  }
  const errors = issuesByField(issues);
  return (
    <form method="post" onSubmit={onSubmit} className="panel grid gap-3 p-4 md:grid-cols-5 md:items-end" noValidate>
      <label className="md:col-span-2"><span className="field-label">New survey</span><input name="name" className="field-input" placeholder="e.g. Autumn 2027" />{errors.name && <span className="field-error">{errors.name}</span>}</label>
      <label><span className="field-label">Starts</span><input name="startsOn" type="date" className="field-input" />{errors.startsOn && <span className="field-error">{errors.startsOn}</span>}</label>
      <label><span className="field-label">Ends</span><input name="endsOn" type="date" className="field-input" />{errors.endsOn && <span className="field-error">{errors.endsOn}</span>}</label>
      <label><span className="field-label">Status</span>
        <select name="status" className="field-input" defaultValue="planned"><option value="planned">Planned</option><option value="in_progress">In progress</option></select>
      </label>
      <div className="md:col-span-5 flex items-center gap-3"><SubmitButton className="btn-primary">Add survey</SubmitButton><FormError message={message} issues={issues} fields={['name', 'startsOn', 'endsOn', 'status']} /></div>
    </form>
  );
}

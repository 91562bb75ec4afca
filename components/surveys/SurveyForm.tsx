'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { FormError } from '@/components/FormError';
import { useActionForm } from '@/components/useActionForm';
import { createSurveyAction } from '@/lib/actions/register';

export function SurveyForm({ siteId }: { siteId: number }) {
  const { handler, message, issues, errors } = useActionForm();
  const onSubmit = handler((form) => createSurveyAction({
    siteId,
    survey: { name: form.get('name'), startsOn: form.get('startsOn'), endsOn: form.get('endsOn'), status: form.get('status') },
  }));
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

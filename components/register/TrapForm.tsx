'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { useRouter } from 'next/navigation';
import { FormError } from '@/components/FormError';
import { useActionForm } from '@/components/useActionForm';
import { createTrapAction, updateTrapAction } from '@/lib/actions/register';
import {
  APPLICATIONS, APPLICATION_LABELS, CRITICALITIES, CRITICALITY_LABELS, DISCHARGES_TO, DISCHARGES_TO_LABELS,
  TRAP_STATUSES, TRAP_STATUS_LABELS, TRAP_TYPES, TRAP_TYPE_LABELS,
} from '@/lib/domain/vocabulary';
import type { TrapDto } from '@/lib/services/dto';
import { fieldIssues } from '@/lib/http/zod-issues';
import { trapInputSchema } from '@/lib/validation/trap';

const FIELDS = ['tag', 'areaId', 'location', 'trapType', 'application', 'sizeDn', 'orificeMm', 'pressureBarg', 'dischargesTo', 'criticality', 'status'];

/** Form values are strings; the shared schema wants numbers and nulls. */
function readForm(form: FormData) {
  const text = (name: string) => String(form.get(name) ?? '').trim();
  const number = (name: string) => (text(name) === '' ? null : Number(text(name).replace(',', '.')));
  return {
    tag: text('tag'),
    areaId: number('areaId'),
    location: text('location') || null,
    trapType: text('trapType'),
    application: text('application') || null,
    sizeDn: number('sizeDn'),
    orificeMm: number('orificeMm'),
    pressureBarg: text('pressureBarg') === '' ? undefined : number('pressureBarg'),
    dischargesTo: text('dischargesTo'),
    criticality: text('criticality'),
    status: text('status'),
  };
}

export function TrapForm({ siteId, areas, trap }: { siteId: number; areas: { id: number; name: string }[]; trap?: TrapDto }) {
  const router = useRouter();
  const { handler, fail, message, issues, errors, busy } = useActionForm();

  const onSubmit = handler(
    (form) => {
      const values = readForm(form);
      const checked = trapInputSchema.safeParse(values);
      if (!checked.success) {
        fail('Some fields need attention.', fieldIssues(checked.error));
        return null;
      }
      return trap ? updateTrapAction({ trapId: trap.id, trap: values }) : createTrapAction({ siteId, trap: values });
    },
    (saved) => router.push(`/sites/${siteId}/traps/${saved.id}`),
    { reset: false },
  );

  const field = (name: string, label: string, input: React.ReactNode, hint?: string) => (
    <label className="block">
      <span className="field-label">{label}</span>
      {input}
      {hint && !errors[name] && <span className="mt-1 block text-xs text-ink-faint">{hint}</span>}
      {errors[name] && <span className="field-error">{errors[name]}</span>}
    </label>
  );

  return (
    <form method="post" onSubmit={onSubmit} className="panel grid gap-4 p-5 md:grid-cols-2" noValidate>
      {field('tag', 'Tag', <input name="tag" defaultValue={trap?.tag} className="field-input tag-text" required aria-invalid={!!errors.tag} />, 'As painted on the trap tag, e.g. FV-EVP-031.')}
      {field('areaId', 'Area', (
        <select name="areaId" defaultValue={trap?.areaId ?? ''} className="field-input">
          <option value="">No area</option>
          {areas.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
        </select>
      ))}
      <div className="md:col-span-2">{field('location', 'Location', <input name="location" defaultValue={trap?.location ?? ''} className="field-input" />, 'Where to find it: equipment, bay, height.')}</div>
      {field('trapType', 'Trap type', (
        <select name="trapType" defaultValue={trap?.trapType ?? ''} className="field-input" required>
          <option value="" disabled>Choose…</option>
          {TRAP_TYPES.map((t) => <option key={t} value={t}>{TRAP_TYPE_LABELS[t]}</option>)}
        </select>
      ))}
      {field('application', 'Application', (
        <select name="application" defaultValue={trap?.application ?? ''} className="field-input">
          <option value="">Not recorded</option>
          {APPLICATIONS.map((a) => <option key={a} value={a}>{APPLICATION_LABELS[a]}</option>)}
        </select>
      ))}
      {field('pressureBarg', 'Line pressure (barg)', <input name="pressureBarg" inputMode="decimal" defaultValue={trap?.pressureBarg ?? ''} className="field-input" required />)}
      {field('sizeDn', 'Connection size (DN)', <input name="sizeDn" inputMode="numeric" defaultValue={trap?.sizeDn ?? ''} className="field-input" />)}
      {field('orificeMm', 'Orifice (mm)', <input name="orificeMm" inputMode="decimal" defaultValue={trap?.orificeMm ?? ''} className="field-input" />, 'If known; otherwise a default by size is used for loss estimates.')}
      {field('dischargesTo', 'Discharges to', (
        <select name="dischargesTo" defaultValue={trap?.dischargesTo ?? 'return'} className="field-input">
          {DISCHARGES_TO.map((d) => <option key={d} value={d}>{DISCHARGES_TO_LABELS[d]}</option>)}
        </select>
      ))}
      {field('criticality', 'Criticality', (
        <select name="criticality" defaultValue={trap?.criticality ?? 'normal'} className="field-input">
          {CRITICALITIES.map((c) => <option key={c} value={c}>{CRITICALITY_LABELS[c]}</option>)}
        </select>
      ))}
      {field('status', 'Status', (
        <select name="status" defaultValue={trap?.status ?? 'in_service'} className="field-input">
          {TRAP_STATUSES.map((s) => <option key={s} value={s}>{TRAP_STATUS_LABELS[s]}</option>)}
        </select>
      ), 'Traps are never deleted: mark one removed instead.')}
      <div className="space-y-3 md:col-span-2">
        <FormError message={message} issues={issues} fields={FIELDS} />
        <div className="flex gap-2">
          <SubmitButton className="btn-primary" busy={busy}>{busy ? 'Saving…' : trap ? 'Save changes' : 'Add trap'}</SubmitButton>
          <button type="button" className="btn-quiet" onClick={() => router.back()}>Cancel</button>
        </div>
      </div>
    </form>
  );
}

'use client';

import { SubmitButton } from '@/components/SubmitButton';
import { FormError } from '@/components/FormError';
import { useActionForm } from '@/components/useActionForm';
import { createSiteAction } from '@/lib/actions/settings';
import { UNIT_SYSTEMS, UNIT_SYSTEM_LABELS } from '@/lib/domain/vocabulary';
import type { SiteDto } from '@/lib/services/dto';

export function SiteSettings({ sites }: { sites: (SiteDto & { trapCount: number })[] }) {
  const { handler, message, issues, errors } = useActionForm();
  const onSubmit = handler((f) => createSiteAction({
    name: f.get('name'), code: f.get('code'), timeZone: f.get('timeZone'), currency: f.get('currency'),
    unitSystem: f.get('unitSystem'), ambientC: Number(f.get('ambientC')),
  }));
  const input = (name: string, label: string, props: React.InputHTMLAttributes<HTMLInputElement> = {}) => (
    <label><span className="field-label">{label}</span><input name={name} className="field-input" {...props} />{errors[name] && <span className="field-error">{errors[name]}</span>}</label>
  );
  return (
    <div className="space-y-4">
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>Site</th><th>Code</th><th>Time zone</th><th>Currency</th><th>Units</th><th className="text-right">Traps</th></tr></thead>
          <tbody>
            {sites.map((s) => (
              <tr key={s.id}><td className="font-medium">{s.name}</td><td>{s.code}</td><td>{s.timeZone}</td><td>{s.currency}</td><td>{UNIT_SYSTEM_LABELS[s.unitSystem]}</td><td className="text-right">{s.trapCount}</td></tr>
            ))}
          </tbody>
        </table>
      </div>
      <form method="post" onSubmit={onSubmit} className="panel grid gap-3 p-4 md:grid-cols-3" noValidate>
        <h2 className="font-semibold md:col-span-3">New site</h2>
        {input('name', 'Name', { placeholder: 'e.g. Harrowgate Maltings' })}
        {input('code', 'Short code', { placeholder: 'e.g. HM', maxLength: 12 })}
        {input('timeZone', 'Time zone (IANA)', { defaultValue: 'Europe/London' })}
        {input('currency', 'Currency', { defaultValue: 'EUR', maxLength: 3 })}
        <label><span className="field-label">Units shown</span>
          <select name="unitSystem" className="field-input" defaultValue="si">{UNIT_SYSTEMS.map((u) => <option key={u} value={u}>{UNIT_SYSTEM_LABELS[u]}</option>)}</select>
        </label>
        {input('ambientC', 'Ambient (°C)', { defaultValue: '20', inputMode: 'decimal' })}
        <div className="flex items-center gap-3 md:col-span-3"><SubmitButton className="btn-primary">Create site</SubmitButton><FormError message={message} issues={issues} fields={['name', 'code', 'timeZone', 'currency', 'unitSystem', 'ambientC']} /></div>
      </form>
    </div>
  );
}

'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormError, issuesByField } from '@/components/FormError';
import { SubmitButton } from '@/components/SubmitButton';
import { EPA_TABLE_C1_KG_PER_MMBTU } from '@/lib/analysis/defaults';
import { GJ_PER_MMBTU } from '@/lib/analysis/units';
import type { FieldIssue } from '@/lib/http/zod-issues';
import type { CostSettings } from '@/lib/outcomes/cost-params';
import { costSettingsSchema, FUELS } from '@/lib/validation/cost-settings';

const FUEL_LABELS: Record<(typeof FUELS)[number], string> = {
  natural_gas: 'Natural gas', distillate_fuel_oil_no2: 'Distillate fuel oil No. 2', bituminous_coal: 'Bituminous coal', other: 'Other (enter its factor)',
};
const EPA_SOURCE = 'EPA 40 CFR Part 98 Subpart C, Table C-1 (81 FR 89188)';

export function CostSettingsForm({ siteId, settings, canEdit }: { siteId: number; settings: CostSettings; canEdit: boolean }) {
  const router = useRouter();
  const [fuel, setFuel] = useState(settings.fuel);
  const [factor, setFactor] = useState({ kg: settings.co2KgPerGj, source: settings.co2FactorSource, year: settings.co2FactorYear });
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  const [saved, setSaved] = useState(false);
  const errors = issuesByField(issues);

  function chooseFuel(next: string) {
    setFuel(next);
    if (next in EPA_TABLE_C1_KG_PER_MMBTU) {
      // The EPA factor for the fuel, per GJ (Table C-1 gives kg per mmBtu, HHV).
      const perMmbtu = EPA_TABLE_C1_KG_PER_MMBTU[next as keyof typeof EPA_TABLE_C1_KG_PER_MMBTU];
      setFactor({ kg: Math.round((perMmbtu / GJ_PER_MMBTU) * 100) / 100, source: EPA_SOURCE, year: 2016 });
    }
  }

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const num = (name: string) => (String(f.get(name) ?? '').trim() === '' ? null : Number(String(f.get(name)).replace(',', '.')));
    const input = {
      operatingHoursPerYear: num('operatingHoursPerYear'), steamPricePerTonne: num('steamPricePerTonne'), fuelPricePerGj: num('fuelPricePerGj'),
      boilerEfficiency: (num('boilerEfficiencyPct') ?? NaN) / 100, feedwaterC: num('feedwaterC'), fuel,
      co2KgPerGj: num('co2KgPerGj'), co2FactorSource: String(f.get('co2FactorSource') ?? ''), co2FactorYear: num('co2FactorYear'),
    };
    const checked = costSettingsSchema.safeParse(input);
    if (!checked.success) {
      setIssues(checked.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })));
      setMessage('Some fields need attention.');
      return;
    }
    const res = await fetch(`/api/sites/${siteId}/cost-settings`, { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify(checked.data) });
    const body = await res.json();
    if (!res.ok) {
      setMessage(body.error.message);
      setIssues(Array.isArray(body.error.details) ? body.error.details : []);
      return;
    }
    setMessage(null);
    setIssues([]);
    setSaved(true);
    router.refresh();
  }

  const field = (name: string, label: string, value: string | number | null, hint?: string, errorKey = name) => (
    <label className="block"><span className="field-label">{label}</span>
      <input name={name} defaultValue={value ?? ''} className="field-input" inputMode="decimal" disabled={!canEdit} />
      {errors[errorKey] ? <span className="field-error">{errors[errorKey]}</span> : hint && <span className="mt-1 block text-xs text-ink-faint">{hint}</span>}
    </label>
  );

  return (
    <form onSubmit={onSubmit} className="panel grid gap-4 p-5 md:grid-cols-2" noValidate>
      {field('operatingHoursPerYear', 'Operating hours per year', settings.operatingHoursPerYear, 'Hours the steam system is live; 8,760 is all year.')}
      {field('feedwaterC', 'Feedwater temperature (°C)', settings.feedwaterC, 'Energy of lost steam counts from this temperature up.')}
      {field('steamPricePerTonne', `Steam price per tonne (${settings.currency})`, settings.steamPricePerTonne, 'Used when set; otherwise the fuel price below.')}
      {field('fuelPricePerGj', `Fuel price per GJ (${settings.currency})`, settings.fuelPricePerGj, 'On the same heating-value basis as the boiler efficiency.')}
      {field('boilerEfficiencyPct', 'Boiler efficiency (%)', Math.round(settings.boilerEfficiency * 1000) / 10, undefined, 'boilerEfficiency')}
      <label className="block"><span className="field-label">Fuel</span>
        <select className="field-input" value={fuel} onChange={(e) => chooseFuel(e.target.value)} disabled={!canEdit}>{FUELS.map((x) => <option key={x} value={x}>{FUEL_LABELS[x]}</option>)}</select>
      </label>
      <label className="block"><span className="field-label">CO2 factor (kg per GJ of fuel)</span>
        <input name="co2KgPerGj" value={factor.kg} onChange={(e) => setFactor({ ...factor, kg: Number(e.target.value) })} className="field-input" inputMode="decimal" disabled={!canEdit} />
        {errors.co2KgPerGj && <span className="field-error">{errors.co2KgPerGj}</span>}
      </label>
      <label className="block"><span className="field-label">Factor source and year</span>
        <div className="flex gap-2">
          <input name="co2FactorSource" value={factor.source} onChange={(e) => setFactor({ ...factor, source: e.target.value })} className="field-input" disabled={!canEdit} />
          <input name="co2FactorYear" value={factor.year} onChange={(e) => setFactor({ ...factor, year: Number(e.target.value) })} className="field-input w-24" inputMode="numeric" disabled={!canEdit} />
        </div>
        {(errors.co2FactorSource || errors.co2FactorYear) && <span className="field-error">{errors.co2FactorSource ?? errors.co2FactorYear}</span>}
      </label>
      <div className="space-y-2 md:col-span-2">
        <p className="text-xs text-ink-faint">Surveys in progress follow these settings at once; published surveys keep the settings they were published with.</p>
        {canEdit ? <div className="flex items-center gap-3"><SubmitButton>Save settings</SubmitButton>{saved && !message && <span className="text-sm text-accent-700" role="status">Saved.</span>}</div> : <p className="text-sm text-ink-soft">Only an admin changes these settings.</p>}
        <FormError message={message} issues={issues} fields={['operatingHoursPerYear', 'steamPricePerTonne', 'fuelPricePerGj', 'boilerEfficiency', 'feedwaterC', 'co2KgPerGj', 'co2FactorSource', 'co2FactorYear']} />
      </div>
    </form>
  );
}

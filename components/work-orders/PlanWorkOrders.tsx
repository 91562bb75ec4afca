'use client';

import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { VerdictBadge } from '@/components/review/VerdictBadge';
import { callApi } from '@/components/uploads/apiClient';
import { WORK_ORDER_ACTION_CODES, WORK_ORDER_ACTION_LABELS, WORK_ORDER_STATUS_LABELS } from '@/lib/api/work-order-routes';
import { formatMoney, PriorityBadge } from './WorkOrderBadges';

type Action = (typeof WORK_ORDER_ACTION_CODES)[number];
type Candidate = {
  trapId: number; tag: string; areaName: string | null; location: string | null; application: string | null; criticality: string;
  verdict: string; kgPerHour: number | null; tonnesPerYear: number | null; costPerYear: number | null;
  priority: string; priorityReason: string; order: { id: number; status: string } | null;
};
type Candidates = { surveyId: number; currency: string; items: Candidate[]; technicians: { id: number; name: string; email: string }[] };
type Row = { picked: boolean; action: Action; assigneeId: string; dueOn: string };

/** The verdict's usual first action: a cold or backed-up trap often has a blocked strainer. */
const defaultAction = (verdict: string): Action => (verdict === 'cold' || verdict === 'backing_up' ? 'clean_strainer' : 'repair');

export function PlanWorkOrders({ siteId, surveyId, candidates }: { siteId: number; surveyId: number; candidates: Candidates }) {
  const router = useRouter();
  const open = candidates.items.filter((c) => !c.order);
  const [rows, setRows] = useState<Record<number, Row>>(() =>
    Object.fromEntries(open.map((c) => [c.trapId, { picked: false, action: defaultAction(c.verdict), assigneeId: '', dueOn: '' }])));
  const [bulk, setBulk] = useState({ assigneeId: '', dueOn: '' });
  const [error, setError] = useState<{ message: string; details: string[] } | null>(null);
  const [busy, setBusy] = useState(false);
  const picked = useMemo(() => open.filter((c) => rows[c.trapId]?.picked), [open, rows]);
  const set = (trapId: number, change: Partial<Row>) => setRows((r) => ({ ...r, [trapId]: { ...r[trapId], ...change } }));
  const allPicked = open.length > 0 && picked.length === open.length;

  function applyBulk() {
    setRows((r) => Object.fromEntries(Object.entries(r).map(([id, row]) => [id, row.picked ? {
      ...row, ...(bulk.assigneeId ? { assigneeId: bulk.assigneeId } : {}), ...(bulk.dueOn ? { dueOn: bulk.dueOn } : {}),
    } : row])));
  }

  async function create() {
    setBusy(true);
    setError(null);
    const items = picked.map((c) => {
      const row = rows[c.trapId];
      return { trapId: c.trapId, action: row.action, assigneeId: row.assigneeId ? Number(row.assigneeId) : null, dueOn: row.dueOn || null };
    });
    const res = await callApi<{ items: { id: number }[] }>(`/api/surveys/${surveyId}/work-orders`, { method: 'POST', body: { items } });
    setBusy(false);
    if (!res.ok) {
      const tagOf = (path: string) => picked[Number(path.split('.')[1])]?.tag ?? path;
      setError({ message: res.error.message, details: res.error.details.map((d) => `${tagOf(d.path)}: ${d.message}`) });
      return;
    }
    router.push(`/sites/${siteId}/work-orders?mine=0&created=${res.data.items.length}`);
    router.refresh();
  }

  if (!candidates.items.length) {
    return <p className="panel p-4 text-sm text-ink-soft">This survey has no confirmed failures. Confirm verdicts in the review queue first: only confirmed failures become work orders.</p>;
  }
  return (
    <div className="space-y-3">
      <div className="panel flex flex-wrap items-end gap-3 p-3 text-sm">
        <div className="font-medium">{picked.length} of {open.length} picked</div>
        <label><span className="field-label">Technician for the picked</span>
          <select className="field-input w-56" value={bulk.assigneeId} onChange={(e) => setBulk({ ...bulk, assigneeId: e.target.value })} aria-label="Technician for the picked traps">
            <option value="">—</option>
            {candidates.technicians.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
          </select>
        </label>
        <label><span className="field-label">Due date for the picked</span>
          <input type="date" className="field-input" value={bulk.dueOn} onChange={(e) => setBulk({ ...bulk, dueOn: e.target.value })} aria-label="Due date for the picked traps" />
        </label>
        <button type="button" className="btn-quiet" onClick={applyBulk} disabled={!picked.length}>Apply to picked</button>
        <button type="button" className="btn-primary ml-auto" onClick={create} disabled={busy || !picked.length} data-testid="create-work-orders">
          {busy ? 'Creating…' : `Create ${picked.length || ''} work order${picked.length === 1 ? '' : 's'}`}
        </button>
      </div>
      {!candidates.technicians.length && <p className="text-sm text-ink-soft">This site has no active technician yet: orders can be made now and assigned later.</p>}
      {error && (
        <div role="alert" className="rounded-md border border-danger-line bg-danger-bg p-3 text-sm text-danger-ink">
          <p className="font-medium">{error.message}</p>
          {error.details.length > 0 && <ul className="mt-1 list-disc pl-5">{error.details.map((d) => <li key={d}>{d}</li>)}</ul>}
        </div>
      )}
      <div className="panel overflow-x-auto">
        <table className="data-table" data-testid="candidates">
          <thead>
            <tr>
              <th><input type="checkbox" aria-label="Pick all" checked={allPicked} onChange={(e) => setRows((r) => Object.fromEntries(Object.entries(r).map(([id, row]) => [id, { ...row, picked: e.target.checked }])))} /></th>
              <th>Trap</th><th>Verdict</th><th className="text-right">Loss</th><th className="text-right">Cost/yr</th><th>Priority and why</th><th>Action</th><th>Technician</th><th>Due</th>
            </tr>
          </thead>
          <tbody>
            {candidates.items.map((c) => {
              const row = rows[c.trapId];
              return (
                <tr key={c.trapId} data-testid={`candidate-${c.tag}`} className={row?.picked ? 'bg-accent-50' : ''}>
                  <td>{row ? <input type="checkbox" aria-label={`Pick ${c.tag}`} checked={row.picked} onChange={(e) => set(c.trapId, { picked: e.target.checked })} /> : null}</td>
                  <td><div className="tag-text whitespace-nowrap">{c.tag}</div><div className="whitespace-nowrap text-xs text-ink-faint">{c.areaName ?? 'No area'}{c.application === 'drip' ? ' · drip on main' : ''}</div></td>
                  <td><VerdictBadge code={c.verdict} /></td>
                  <td className="whitespace-nowrap text-right tabular-nums">{c.kgPerHour === null ? '—' : `${c.kgPerHour.toFixed(1)} kg/h`}</td>
                  <td className="whitespace-nowrap text-right tabular-nums">{formatMoney(c.costPerYear, candidates.currency)}</td>
                  <td className="min-w-56"><PriorityBadge priority={c.priority} /><div className="text-xs text-ink-soft">{c.priorityReason}</div></td>
                  {row ? (
                    <>
                      <td><select className="field-input mt-0 w-36" aria-label={`Action for ${c.tag}`} value={row.action} onChange={(e) => set(c.trapId, { action: e.target.value as Action })}>
                        {WORK_ORDER_ACTION_CODES.map((a) => <option key={a} value={a}>{WORK_ORDER_ACTION_LABELS[a]}</option>)}
                      </select></td>
                      <td><select className="field-input mt-0 w-44" aria-label={`Technician for ${c.tag}`} value={row.assigneeId} onChange={(e) => set(c.trapId, { assigneeId: e.target.value })}>
                        <option value="">not yet</option>
                        {candidates.technicians.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
                      </select></td>
                      <td><input type="date" className="field-input mt-0 w-36" aria-label={`Due date for ${c.tag}`} value={row.dueOn} onChange={(e) => set(c.trapId, { dueOn: e.target.value })} /></td>
                    </>
                  ) : (
                    <td colSpan={3} className="text-sm">
                      <a className="text-accent-700 hover:underline" href={`/sites/${siteId}/work-orders/${c.order!.id}`}>Work order #{c.order!.id}</a>{' '}
                      <span className="text-ink-soft">{WORK_ORDER_STATUS_LABELS[c.order!.status as keyof typeof WORK_ORDER_STATUS_LABELS]}</span>
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}

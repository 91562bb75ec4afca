'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { callApi } from '@/components/uploads/apiClient';
import { WORK_ORDER_ACTION_CODES, WORK_ORDER_ACTION_LABELS } from '@/lib/api/work-order-routes';

type Order = { id: number; status: string; action: string; assigneeId: number | null; dueOn: string | null; notes: string | null; currency: string };

/** Planning (analysts) and recording the work done (technicians), as the order's status allows. */
export function WorkOrderActions({ order, technicians, mayPlan, mayRecord }: {
  order: Order; technicians: { id: number; name: string }[]; mayPlan: boolean; mayRecord: boolean;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const canPlan = mayPlan && ['open', 'scheduled', 'reopened'].includes(order.status);
  const canRecord = mayRecord && ['scheduled', 'reopened'].includes(order.status);

  async function send(url: string, method: string, body: unknown) {
    setBusy(true);
    setError(null);
    const res = await callApi(url, { method, body });
    setBusy(false);
    if (!res.ok) {
      setError([res.error.message, ...res.error.details.map((d) => `${d.path}: ${d.message}`)].join(' '));
      return;
    }
    router.refresh();
  }

  function plan(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const assignee = String(f.get('assigneeId') ?? '');
    void send(`/api/work-orders/${order.id}`, 'PATCH', {
      action: f.get('action'), assigneeId: assignee ? Number(assignee) : null, dueOn: String(f.get('dueOn') ?? '') || null,
      notes: String(f.get('notes') ?? '') || null,
    });
  }

  function done(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const cost = String(f.get('repairCost') ?? '').trim();
    void send(`/api/work-orders/${order.id}/done`, 'POST', { repairCost: cost === '' ? null : Number(cost), notes: String(f.get('notes') ?? '') || null });
  }

  if (!canPlan && !canRecord) {
    return order.status === 'done'
      ? <p className="text-sm text-ink-soft">Done. The next trap-point test of this trap, uploaded after the work, verifies it (working) or re-opens it (still failed).</p>
      : order.status === 'verified' ? <p className="text-sm text-ink-soft">Verified by a re-test: closed.</p>
        : order.status === 'open' ? <p className="text-sm text-ink-soft">Waiting for an analyst to assign a technician and a due date.</p> : null;
  }
  return (
    <div className="grid gap-4 md:grid-cols-2">
      {canRecord && (
        <form onSubmit={done} className="space-y-2 rounded-md border border-line p-3" data-testid="mark-done">
          <h3 className="font-semibold">Record the work done</h3>
          <label className="block"><span className="field-label">Repair cost ({order.currency})</span><input name="repairCost" type="number" min="0" step="0.01" inputMode="decimal" className="field-input" /></label>
          <label className="block"><span className="field-label">Notes</span><textarea name="notes" rows={3} className="field-input" placeholder="What was found and done, parts used" defaultValue="" /></label>
          <button type="submit" className="btn-primary" disabled={busy}>Mark done</button>
        </form>
      )}
      {canPlan && (
        <form onSubmit={plan} className="space-y-2 rounded-md border border-line p-3" data-testid="plan-order">
          <h3 className="font-semibold">Plan</h3>
          <label className="block"><span className="field-label">Action</span>
            <select name="action" className="field-input" defaultValue={order.action}>{WORK_ORDER_ACTION_CODES.map((a) => <option key={a} value={a}>{WORK_ORDER_ACTION_LABELS[a]}</option>)}</select>
          </label>
          <label className="block"><span className="field-label">Technician</span>
            <select name="assigneeId" className="field-input" defaultValue={order.assigneeId ?? ''}>
              <option value="">not assigned</option>
              {technicians.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
            </select>
          </label>
          <label className="block"><span className="field-label">Due date</span><input name="dueOn" type="date" className="field-input" defaultValue={order.dueOn ?? ''} /></label>
          <label className="block"><span className="field-label">Notes</span><textarea name="notes" rows={2} className="field-input" defaultValue={order.notes ?? ''} /></label>
          <button type="submit" className="btn-quiet" disabled={busy}>Save plan</button>
          <p className="text-xs text-ink-faint">With a technician and a due date the order is scheduled, and the technician is e-mailed.</p>
        </form>
      )}
      {error && <p role="alert" className="text-sm text-danger-ink md:col-span-2">{error}</p>}
    </div>
  );
}

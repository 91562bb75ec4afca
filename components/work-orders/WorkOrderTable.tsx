import Link from 'next/link';
import { VerdictBadge } from '@/components/review/VerdictBadge';
import { WORK_ORDER_ACTION_LABELS } from '@/lib/api/work-order-routes';
import type { WorkOrderDto } from '@/lib/services/work-orders';
import { formatMoney, PriorityBadge, WorkOrderStatusBadge } from './WorkOrderBadges';

/** Work orders as a table; `showTrap` off where the page is already about one trap. */
export function WorkOrderTable({ orders, siteId, showTrap = true }: { orders: WorkOrderDto[]; siteId: number; showTrap?: boolean }) {
  if (!orders.length) return <p className="p-4 text-sm text-ink-soft">No work orders here.</p>;
  return (
    <table className="data-table" data-testid="work-order-table">
      <thead>
        <tr>
          <th>#</th>{showTrap && <th>Trap</th>}<th>Found</th><th>Action</th><th>Priority</th><th>Assignee</th><th>Due</th><th>Status</th><th className="text-right">Cost/yr</th>
        </tr>
      </thead>
      <tbody>
        {orders.map((o) => (
          <tr key={o.id} data-testid={`work-order-${o.id}`}>
            <td><Link className="font-medium text-accent-700 hover:underline" href={`/sites/${siteId}/work-orders/${o.id}`}>#{o.id}</Link></td>
            {showTrap && <td><div className="tag-text whitespace-nowrap">{o.tag}</div><div className="text-xs text-ink-faint">{o.areaName ?? 'No area'}</div></td>}
            <td><VerdictBadge code={o.verdict} /></td>
            <td>{WORK_ORDER_ACTION_LABELS[o.action]}</td>
            <td><PriorityBadge priority={o.priority} /></td>
            <td>{o.assigneeName ?? <span className="text-ink-faint">not assigned</span>}</td>
            <td className="whitespace-nowrap">{o.dueOn ?? '—'}{o.overdue && <span className="ml-1 text-xs font-semibold text-danger-ink">overdue</span>}</td>
            <td><WorkOrderStatusBadge status={o.status} /></td>
            <td className="text-right tabular-nums">{formatMoney(o.costPerYear, o.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

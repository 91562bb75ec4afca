import Link from 'next/link';
import { notFound } from 'next/navigation';
import { VerdictBadge } from '@/components/review/VerdictBadge';
import { SafetyCaution } from '@/components/SafetyCaution';
import { formatMoney, PriorityBadge, WorkOrderStatusBadge } from '@/components/work-orders/WorkOrderBadges';
import { WorkOrderActions } from '@/components/work-orders/WorkOrderActions';
import { WORK_ORDER_ACTION_LABELS } from '@/lib/api/work-order-routes';
import { may, requireSiteActor } from '@/lib/auth/page';
import { getWorkOrder, techniciansOf } from '@/lib/services/work-orders';

export const metadata = { title: 'Work order' };

const when = (iso: string | null) => (iso ? `${iso.replace('T', ' ').slice(0, 16)} UTC` : '—');

export default async function WorkOrderPage({ params }: { params: Promise<{ siteId: string; workOrderId: string }> }) {
  const { siteId: rawSiteId, workOrderId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'survey.read');
  const id = Number(workOrderId);
  const order = Number.isInteger(id) && id > 0 ? await getWorkOrder(id).catch(() => null) : null;
  if (!order || order.siteId !== siteId) notFound();
  const technicians = may(actor, 'workorder.plan') ? await techniciansOf(siteId) : [];
  const rows: [string, React.ReactNode][] = [
    ['Trap', <Link key="t" className="tag-text text-accent-700 hover:underline" href={`/sites/${siteId}/traps/${order.trapId}`}>{order.tag}</Link>],
    ['Area', order.areaName ?? '—'],
    ['Location', order.location ?? '—'],
    ['Found in', order.surveyName],
    ['Verdict', <VerdictBadge key="v" code={order.verdict} />],
    ['Action', WORK_ORDER_ACTION_LABELS[order.action]],
    ['Assignee', order.assigneeName ?? 'not assigned'],
    ['Due', <span key="d">{order.dueOn ?? '—'}{order.overdue && <span className="ml-1 font-semibold text-danger-ink">overdue</span>}</span>],
    ['Steam lost', order.lossKgPerHour === null ? '—' : `${order.lossKgPerHour.toFixed(1)} kg/h`],
    ['Cost of the loss', order.costPerYear === null ? '—' : `${formatMoney(order.costPerYear, order.currency)} a year`],
    ['Repair cost', formatMoney(order.repairCost, order.currency)],
    ['Done', order.doneAt ? `${when(order.doneAt)} by ${order.doneBy ?? '—'}` : '—'],
    ['Verified', order.verifiedAt ? `${when(order.verifiedAt)} by re-test #${order.verifiedByTestId}` : '—'],
  ];
  return (
    <div className="space-y-5">
      <div>
        <Link href={`/sites/${siteId}/work-orders`} className="text-sm text-ink-soft hover:underline">← Work orders</Link>
        <div className="flex flex-wrap items-center gap-3">
          <h2 className="text-2xl font-semibold">Work order #{order.id}</h2>
          <WorkOrderStatusBadge status={order.status} />
        </div>
      </div>
      <div className="grid gap-5 lg:grid-cols-3">
        <section className="panel space-y-4 p-5 lg:col-span-2">
          <div className="rounded-md bg-surface-sunken p-3 text-sm" data-testid="priority">
            <div className="mb-1 flex items-center gap-2"><span className="field-label">Priority</span><PriorityBadge priority={order.priority} /></div>
            <p className="text-ink-soft">{order.priorityReason ?? 'No reason recorded.'}</p>
          </div>
          <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
            {rows.map(([label, value]) => (
              <div key={label} className="flex justify-between gap-3 border-b border-line py-1.5"><dt className="text-ink-soft">{label}</dt><dd className="text-right">{value}</dd></div>
            ))}
          </dl>
          {order.notes && <div className="text-sm"><div className="field-label">Notes</div><p className="whitespace-pre-wrap">{order.notes}</p></div>}
          {order.status === 'reopened' && (
            <p className="rounded-md border border-danger-line bg-danger-bg p-3 text-sm text-danger-ink">The re-test after the work still found this trap failed. Do the work again and mark it done; the next re-test decides again.</p>
          )}
          <WorkOrderActions
            order={{ id: order.id, status: order.status, action: order.action, assigneeId: order.assigneeId, dueOn: order.dueOn, notes: order.notes, currency: order.currency }}
            technicians={technicians} mayPlan={may(actor, 'workorder.plan')} mayRecord={may(actor, 'workorder.record')}
          />
        </section>
        <div className="self-start"><SafetyCaution context="Before this repair" /></div>
      </div>
      <section className="panel p-5">
        <h3 className="mb-3 font-semibold">What happened</h3>
        <ol className="space-y-2 text-sm" data-testid="work-order-trail">
          {order.trail.map((e) => (
            <li key={e.id} className="border-b border-line pb-2">
              <span className="font-medium">{e.action.replace('workorder.', '')}</span> by {e.by} · <time dateTime={e.at}>{when(e.at)}</time>
              {e.reason && <div className="text-ink-soft">{e.reason}</div>}
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}

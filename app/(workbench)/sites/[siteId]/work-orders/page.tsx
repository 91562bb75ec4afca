import Link from 'next/link';
import { SafetyCaution } from '@/components/SafetyCaution';
import { WorkOrderTable } from '@/components/work-orders/WorkOrderTable';
import { WORK_ORDER_STATUS_CODES, WORK_ORDER_STATUS_LABELS } from '@/lib/api/work-order-routes';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listSurveys } from '@/lib/services/surveys';
import { listWorkOrders } from '@/lib/services/work-orders';

export const metadata = { title: 'Work orders' };

type Status = (typeof WORK_ORDER_STATUS_CODES)[number];

export default async function WorkOrdersPage({ params, searchParams }: {
  params: Promise<{ siteId: string }>; searchParams: Promise<{ status?: string; mine?: string }>;
}) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'survey.read');
  const query = await searchParams;
  // A technician starts from their own orders; everyone may switch to all of the site's.
  const mine = query.mine ? query.mine === '1' : actor.role === 'technician';
  const status = WORK_ORDER_STATUS_CODES.includes(query.status as Status) ? (query.status as Status) : undefined;
  const [{ items }, surveys] = await Promise.all([
    listWorkOrders(actor, siteId, { mine, status }),
    may(actor, 'workorder.plan') ? listSurveys(siteId) : Promise.resolve([]),
  ]);
  const base = `/sites/${siteId}/work-orders`;
  const href = (change: { mine?: boolean; status?: string | null }) => {
    const p = new URLSearchParams();
    const m = change.mine ?? mine;
    p.set('mine', m ? '1' : '0');
    const st = change.status === undefined ? status : change.status;
    if (st) p.set('status', st);
    return `${base}?${p}`;
  };
  const chip = (active: boolean) => `rounded-full border px-3 py-1 text-xs ${active ? 'border-accent-600 bg-accent-50 font-semibold text-accent-800' : 'border-line-strong text-ink-soft hover:bg-surface-sunken'}`;
  const planned = surveys.filter((s) => s.status !== 'planned');
  return (
    <div className="space-y-4">
      <div className="grid gap-4 2xl:grid-cols-3">
        <div className="space-y-3 2xl:col-span-2">
          <nav aria-label="Whose orders" className="flex flex-wrap items-center gap-2">
            <Link className={chip(mine)} href={href({ mine: true })} aria-current={mine ? 'page' : undefined}>Assigned to me</Link>
            <Link className={chip(!mine)} href={href({ mine: false })} aria-current={!mine ? 'page' : undefined}>All of this site</Link>
            <span className="mx-1 text-line-strong" aria-hidden="true">|</span>
            <Link className={chip(!status)} href={href({ status: null })}>Any status</Link>
            {WORK_ORDER_STATUS_CODES.map((s) => (
              <Link key={s} className={chip(status === s)} href={href({ status: s })}>{WORK_ORDER_STATUS_LABELS[s]}</Link>
            ))}
          </nav>
          <div className="panel overflow-x-auto"><WorkOrderTable orders={items} siteId={siteId} /></div>
          <p className="text-xs text-ink-faint">
            Open → scheduled (a technician and a due date) → done (by the technician) → verified when a later re-test of the trap finds it working,
            or re-opened when the re-test still finds it failed.
          </p>
        </div>
        <div className="grid gap-4 lg:grid-cols-2 2xl:grid-cols-1 2xl:content-start">
          {may(actor, 'workorder.plan') && (
            <section className="panel p-4">
              <h2 className="mb-2 font-semibold">Plan repairs from a survey</h2>
              <p className="mb-3 text-sm text-ink-soft">Confirmed failures, costliest first, become work orders with a priority.</p>
              <ul className="space-y-1 text-sm">
                {planned.map((s) => (
                  <li key={s.id}><Link className="text-accent-700 hover:underline" href={`${base}/plan/${s.id}`}>{s.name}</Link> <span className="text-xs text-ink-faint">{s.status.replace('_', ' ')}</span></li>
                ))}
                {!planned.length && <li className="text-ink-faint">No survey with results yet.</li>}
              </ul>
            </section>
          )}
          <SafetyCaution context="Before repair work on a steam trap" compact />
        </div>
      </div>
    </div>
  );
}

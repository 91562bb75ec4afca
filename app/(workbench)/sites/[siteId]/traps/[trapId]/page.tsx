import Link from 'next/link';
import { FieldNotes } from '@/components/review/FieldNotes';
import { TrapHistory } from '@/components/review/TrapHistory';
import { SafetyCaution } from '@/components/SafetyCaution';
import { TrapWorkOrders } from '@/components/work-orders/TrapWorkOrders';
import { may, requireSiteActor } from '@/lib/auth/page';
import {
  APPLICATION_LABELS, CRITICALITY_LABELS, DISCHARGES_TO_LABELS, TRAP_STATUS_LABELS, TRAP_TYPE_LABELS,
} from '@/lib/domain/vocabulary';
import { auditTrail } from '@/lib/services/audit';
import { trapForPage } from './trap-for-page';

export const metadata = { title: 'Trap' };

function describe(values: Record<string, unknown> | null) {
  if (!values) return '';
  return Object.entries(values).filter(([k]) => !['id', 'siteId', 'updatedAt'].includes(k)).map(([k, v]) => `${k}: ${v ?? '—'}`).join(', ');
}

export default async function TrapPage({ params }: { params: Promise<{ siteId: string; trapId: string }> }) {
  const { siteId: rawSiteId, trapId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'register.read');
  const trap = await trapForPage(siteId, trapId);
  const trail = may(actor, 'audit.read') ? await auditTrail('trap', trap.id) : [];
  const rows: [string, React.ReactNode][] = [
    ['Area', trap.areaName ?? '—'],
    ['Location', trap.location ?? '—'],
    ['Trap type', TRAP_TYPE_LABELS[trap.trapType]],
    ['Application', trap.application ? APPLICATION_LABELS[trap.application] : 'Not recorded'],
    ['Line pressure', `${trap.pressureBarg} barg`],
    ['Connection size', trap.sizeDn ? `DN${trap.sizeDn}` : '—'],
    ['Orifice', trap.orificeMm ? `${trap.orificeMm} mm` : 'Not known (default by size)'],
    ['Discharges to', DISCHARGES_TO_LABELS[trap.dischargesTo]],
    ['Criticality', CRITICALITY_LABELS[trap.criticality]],
    ['Status', TRAP_STATUS_LABELS[trap.status]],
  ];
  return (
    <div className="space-y-5">
      <div className="flex items-center justify-between">
        <div>
          <Link href={`/sites/${siteId}/traps`} className="text-sm text-ink-soft hover:underline">← Trap register</Link>
          <h2 className="tag-text text-2xl font-semibold" data-testid="trap-tag">{trap.tag}</h2>
        </div>
        {may(actor, 'trap.write') && <Link href={`/sites/${siteId}/traps/${trap.id}/edit`} className="btn-quiet">Edit trap</Link>}
      </div>
      <div className="grid gap-5 lg:grid-cols-3">
        <section className="panel p-5 lg:col-span-2">
          <h3 className="mb-3 font-semibold">Register data</h3>
          <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
            {rows.map(([label, value]) => (
              <div key={label} className="flex justify-between gap-3 border-b border-line py-1.5">
                <dt className="text-ink-soft">{label}</dt><dd className="text-right">{value}</dd>
              </div>
            ))}
          </dl>
        </section>
        <SafetyCaution context="Before anyone opens, tests or repairs this trap" />
      </div>
      <section className="panel p-5">
        <h3 className="mb-3 font-semibold">Surveys, tests and verdicts</h3>
        <TrapHistory trapId={trap.id} siteId={siteId} />
        <div className="mt-4"><FieldNotes trapId={trap.id} /></div>
      </section>
      <TrapWorkOrders actor={actor} siteId={siteId} trapId={trap.id} />
      {trail.length > 0 && (
        <section className="panel p-5">
          <h3 className="mb-3 font-semibold">Changes to this record</h3>
          <ul className="space-y-2 text-sm">
            {trail.map((e) => (
              <li key={e.id} className="border-b border-line pb-2">
                <div><span className="font-medium">{e.action}</span> by {e.by} · <time dateTime={e.at}>{e.at.replace('T', ' ').slice(0, 16)} UTC</time>{e.reason ? ` · ${e.reason}` : ''}</div>
                {e.before && Object.keys(e.before).length > 0 && <div className="text-ink-soft">from {describe(e.before)}</div>}
                {e.after && <div className="text-ink-soft">{e.before ? 'to' : 'with'} {describe(e.after)}</div>}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}

import Link from 'next/link';
import { SurveyStatusLabel } from '@/components/SurveyStatus';
import { requireSiteActor } from '@/lib/auth/page';
import { TRAP_TYPE_LABELS } from '@/lib/domain/vocabulary';
import { registerBreakdown } from '@/lib/services/site-overview';
import { listSurveys } from '@/lib/services/surveys';

export const metadata = { title: 'Site overview' };

export default async function SiteOverviewPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await requireSiteActor((await params).siteId);
  const [{ byArea, byType }, surveys] = await Promise.all([registerBreakdown(siteId), listSurveys(siteId)]);
  const maxArea = Math.max(1, ...byArea.map((a) => a.inService + a.outOfService));
  const total = byType.reduce((s, t) => s + t.count, 0);
  return (
    <div className="grid gap-5 lg:grid-cols-3">
      <section className="panel p-5 lg:col-span-2" aria-labelledby="by-area">
        <h2 id="by-area" className="mb-3 font-semibold">Register by area</h2>
        <table className="data-table">
          <thead>
            <tr><th>Area</th><th className="w-1/3">Traps</th><th className="text-right">In service</th><th className="text-right">Out of service</th><th className="text-right">Removed</th></tr>
          </thead>
          <tbody>
            {byArea.map((area) => (
              <tr key={area.id ?? 'none'}>
                <td>
                  {area.id ? <Link className="hover:text-accent-700 hover:underline" href={`/sites/${siteId}/traps?areaId=${area.id}`}>{area.name}</Link> : area.name}
                </td>
                <td>
                  <div className="flex h-3 overflow-hidden rounded-sm bg-surface-sunken" aria-hidden="true">
                    <div className="bg-accent-500" style={{ width: `${(100 * area.inService) / maxArea}%` }} />
                    <div className="bg-line-strong" style={{ width: `${(100 * area.outOfService) / maxArea}%` }} />
                  </div>
                </td>
                <td className="text-right">{area.inService}</td>
                <td className="text-right">{area.outOfService}</td>
                <td className="text-right text-ink-faint">{area.removed}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-xs text-ink-faint">Bar: traps in service (teal) and out of service (grey). Survey results per area appear here once tests are imported.</p>
      </section>
      <section className="panel p-5" aria-labelledby="by-type">
        <h2 id="by-type" className="mb-3 font-semibold">Trap types</h2>
        <ul className="space-y-2 text-sm">
          {byType.map((t) => (
            <li key={t.trapType} className="flex justify-between gap-2">
              <span>{TRAP_TYPE_LABELS[t.trapType]}</span>
              <span className="text-ink-soft">{t.count} <span className="text-ink-faint">({Math.round((100 * t.count) / Math.max(1, total))} %)</span></span>
            </li>
          ))}
        </ul>
      </section>
      <section className="panel p-5 lg:col-span-3" aria-labelledby="surveys">
        <div className="mb-3 flex items-center justify-between">
          <h2 id="surveys" className="font-semibold">Surveys</h2>
          <Link className="text-sm text-accent-700 hover:underline" href={`/sites/${siteId}/surveys`}>All surveys</Link>
        </div>
        <table className="data-table">
          <thead><tr><th>Survey</th><th>Dates</th><th>Status</th></tr></thead>
          <tbody>
            {surveys.map((s) => (
              <tr key={s.id}><td>{s.name}</td><td className="text-ink-soft">{s.startsOn} – {s.endsOn}</td><td><SurveyStatusLabel status={s.status} /></td></tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}

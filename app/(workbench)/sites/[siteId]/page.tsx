import Link from 'next/link';
import { SurveyTrendChart } from '@/components/outcomes/SurveyTrendChart';
import { SurveyStatusLabel } from '@/components/SurveyStatus';
import { kgToLb } from '@/lib/analysis/units';
import { requireSiteActor } from '@/lib/auth/page';
import { TRAP_TYPE_LABELS, type SurveyStatus } from '@/lib/domain/vocabulary';
import { money, percent, quantity } from '@/lib/outcomes/format';
import { siteTrends } from '@/lib/services/outcomes';
import { registerBreakdown } from '@/lib/services/site-overview';
import { getSite } from '@/lib/services/sites';

export const metadata = { title: 'Site overview' };

/** Worse (▲) or better (▼) than the survey before, in words as well as shape. */
function change(now: number | null, before: number | null | undefined) {
  if (now === null || before === null || before === undefined) return null;
  const d = (now - before) * 100;
  if (Math.abs(d) < 0.5) return <span className="text-ink-faint"> = same</span>;
  return d > 0 ? <span className="text-[#a35200]"> ▲ {d.toFixed(0)} pts worse</span> : <span className="text-accent-700"> ▼ {(-d).toFixed(0)} pts better</span>;
}

export default async function SiteOverviewPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await requireSiteActor((await params).siteId);
  const [{ byArea, byType }, trends, site] = await Promise.all([registerBreakdown(siteId), siteTrends(siteId), getSite(siteId)]);
  const units = site.unitSystem;
  const total = byType.reduce((s, t) => s + t.count, 0);
  const latest = trends.surveys[trends.surveys.length - 1];
  const first = trends.surveys[0];
  const points = trends.surveys.map((s) => ({ label: s.name, failureRate: s.total.failureRate, lossKgPerHour: s.total.lossKgPerHour }));
  return (
    <div className="space-y-5">
      {latest && (
        <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5" data-testid="site-figures">
          <div className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">Tested · {latest.name}</dt><dd className="text-xl font-semibold">{latest.total.tested} of {latest.total.inService}</dd></div>
          <div className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">Failure rate</dt><dd className="text-xl font-semibold">{percent(latest.total.failureRate)}</dd></div>
          <div className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">Steam lost</dt><dd className="text-xl font-semibold">{quantity(latest.total.lossTonnesPerYear, 'annualMass', units, 0)}</dd></div>
          <div className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">Cost per year</dt><dd className="text-xl font-semibold">{money(latest.total.costPerYear, latest.currency)}</dd></div>
          <div className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">CO2 per year</dt><dd className="text-xl font-semibold">{latest.total.co2TonnesPerYear.toFixed(0)} t</dd></div>
        </dl>
      )}
      {trends.surveys.length > 0 && (
        <section className="panel p-5" aria-labelledby="trend">
          <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="trend" className="font-semibold">Survey by survey</h2>
            <p className="text-sm text-ink-soft">
              Repairs: {trends.repairs.open} open · {trends.repairs.done} done · {trends.repairs.verified} verified by re-test
              {trends.repairs.verified > 0 && <> · saved {quantity(trends.repairs.savedKgPerHour, 'massFlow', units)} ({money(trends.repairs.savedCostPerYear, site.currency)} a year)</>}
              {first && latest && first !== latest && first.total.costPerYear !== null && latest.total.costPerYear !== null && <> · losses since {first.name}: {money(first.total.costPerYear - latest.total.costPerYear, site.currency)} a year less</>}
            </p>
          </div>
          <SurveyTrendChart points={points} lossUnit={units === 'us' ? 'lb/h' : 'kg/h'} lossScale={units === 'us' ? kgToLb(1) : 1} />
          <div className="mt-4 overflow-x-auto">
            <table className="data-table" data-testid="area-trends">
              <thead><tr><th>Area · failure rate</th>{trends.surveys.map((s) => <th key={s.id} className="text-right"><Link className="hover:underline" href={`/sites/${siteId}/surveys/${s.id}`}>{s.name}</Link></th>)}</tr></thead>
              <tbody>
                {trends.areas.map((a) => (
                  <tr key={a.areaName}>
                    <td>{a.areaName}</td>
                    {a.bySurvey.map((x, i) => (
                      <td key={i} className="text-right">{x && x.tested ? <>{percent(x.failureRate)} <span className="text-xs text-ink-faint">({x.failed}/{x.tested})</span>{change(x.failureRate, a.bySurvey[i - 1]?.failureRate)}</> : <span className="text-ink-faint">not tested</span>}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <ul className="mt-3 flex flex-wrap gap-4 text-xs text-ink-soft">{trends.surveys.map((s) => <li key={s.id}>{s.name}: <SurveyStatusLabel status={s.status as SurveyStatus} />{s.frozen ? '' : ' (figures follow the current settings)'}</li>)}</ul>
        </section>
      )}
      <div className="grid gap-5 lg:grid-cols-3">
        <section className="panel p-5 lg:col-span-2" aria-labelledby="by-area">
          <h2 id="by-area" className="mb-3 font-semibold">Register by area</h2>
          <table className="data-table">
            <thead><tr><th>Area</th><th className="text-right">In service</th><th className="text-right">Out of service</th><th className="text-right">Removed</th></tr></thead>
            <tbody>
              {byArea.map((area) => (
                <tr key={area.id ?? 'none'}>
                  <td>{area.id ? <Link className="hover:text-accent-700 hover:underline" href={`/sites/${siteId}/traps?areaId=${area.id}`}>{area.name}</Link> : area.name}</td>
                  <td className="text-right">{area.inService}</td><td className="text-right">{area.outOfService}</td><td className="text-right text-ink-faint">{area.removed}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
        <section className="panel p-5" aria-labelledby="by-type">
          <h2 id="by-type" className="mb-3 font-semibold">Trap types</h2>
          <ul className="space-y-2 text-sm">
            {byType.map((t) => (
              <li key={t.trapType} className="flex justify-between gap-2"><span>{TRAP_TYPE_LABELS[t.trapType]}</span><span className="text-ink-soft">{t.count} <span className="text-ink-faint">({Math.round((100 * t.count) / Math.max(1, total))} %)</span></span></li>
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}

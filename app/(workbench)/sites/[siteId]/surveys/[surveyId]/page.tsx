import Link from 'next/link';
import { notFound } from 'next/navigation';
import { EmailReport } from '@/components/outcomes/EmailReport';
import { PublishSurvey } from '@/components/outcomes/PublishSurvey';
import { ReportDownloads } from '@/components/reports/ReportDownloads';
import { VerdictBar } from '@/components/outcomes/VerdictBar';
import { VerdictBadge } from '@/components/review/VerdictBadge';
import { SurveyStatusLabel } from '@/components/SurveyStatus';
import { may, requireSiteActor } from '@/lib/auth/page';
import type { SurveyStatus } from '@/lib/domain/vocabulary';
import { money, percent, quantity } from '@/lib/outcomes/format';
import { surveySummary } from '@/lib/services/outcomes';
import { getSite } from '@/lib/services/sites';
import { siteIdOfSurvey } from '@/lib/services/surveys';

export const metadata = { title: 'Survey' };

export default async function SurveyPage({ params }: { params: Promise<{ siteId: string; surveyId: string }> }) {
  const { siteId: rawSiteId, surveyId: rawSurveyId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'survey.read');
  const surveyId = Number(rawSurveyId);
  if (!Number.isInteger(surveyId) || (await siteIdOfSurvey(surveyId)) !== siteId) notFound();
  const [{ survey, frozen, settings, figures }, site] = await Promise.all([surveySummary(surveyId), getSite(siteId)]);
  const t = figures.total;
  const units = site.unitSystem;
  const base = `/sites/${siteId}/surveys/${surveyId}`;
  const cards: [string, string, string?][] = [
    ['Traps tested', `${t.tested} of ${t.inService}`, `${percent(t.inService ? t.tested / t.inService : null)} of traps in service`],
    ['Failure rate', percent(t.failureRate), `${t.failed} failed of ${t.tested} tested`],
    ['Steam lost', quantity(t.lossKgPerHour, 'massFlow', units), quantity(t.lossTonnesPerYear, 'annualMass', units, 0)],
    ['Cost per year', money(t.costPerYear, settings.currency), t.costPerYear === null ? 'set a steam or fuel price in the cost settings' : undefined],
    ['CO2 per year', `${t.co2TonnesPerYear.toFixed(1)} t`, settings.co2FactorSource],
  ];
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 className="text-lg font-semibold">{survey.name}</h2>
          <div className="flex items-center gap-3 text-sm text-ink-soft"><span>{survey.startsOn} – {survey.endsOn}</span><SurveyStatusLabel status={survey.status as SurveyStatus} /></div>
        </div>
        <nav className="flex flex-wrap gap-2 text-sm" aria-label="Survey">
          <Link className="btn-quiet" href={`${base}/review`}>Review queue</Link>
          <Link className="btn-quiet" href={`${base}/field`}>Field view</Link>
          <Link className="btn-quiet" href={`/sites/${siteId}/work-orders?surveyId=${surveyId}`}>Work orders</Link>
          {may(actor, 'workorder.plan') && figures.total.failed > 0 && <Link className="btn-primary" href={`/sites/${siteId}/work-orders/plan/${surveyId}`}>Plan repairs</Link>}
        </nav>
      </div>
      <ReportDownloads surveyId={surveyId} published={frozen} />
      {frozen && may(actor, 'report.publish') && <EmailReport surveyId={surveyId} />}
      <p className="text-xs text-ink-faint" data-testid="figures-basis">
        {frozen ? `Published ${survey.publishedAt?.slice(0, 10)}: figures frozen with the settings of that day.` : 'Draft: figures follow the current cost settings.'}{' '}
        {figures.basis.convention}; {figures.basis.operatingHoursPerYear.toLocaleString('en-GB')} operating hours a year;{' '}
        {settings.steamPricePerTonne !== null ? `steam at ${money(settings.steamPricePerTonne, settings.currency)} per tonne` : settings.fuelPricePerGj !== null ? `fuel at ${money(settings.fuelPricePerGj, settings.currency)} per GJ, boiler efficiency ${Math.round(settings.boilerEfficiency * 100)} %` : 'no price set'};{' '}
        CO2 {settings.co2KgPerGj.toFixed(2)} kg per GJ of fuel ({settings.co2FactorSource}, {settings.co2FactorYear}).
      </p>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5" data-testid="survey-figures">
        {cards.map(([label, value, note]) => (
          <div key={label} className="panel p-4"><dt className="text-xs uppercase tracking-wide text-ink-soft">{label}</dt><dd className="text-xl font-semibold">{value}</dd>{note && <dd className="text-xs text-ink-faint">{note}</dd>}</div>
        ))}
      </dl>
      <section className="panel p-5"><h3 className="mb-3 font-semibold">Verdicts</h3><VerdictBar counts={t.verdicts} />
        <p className="mt-2 text-xs text-ink-soft">{t.decided} of {t.tested} verdicts decided by an analyst · {t.retestPending} re-test{t.retestPending === 1 ? '' : 's'} asked · {t.untested} trap{t.untested === 1 ? '' : 's'} in service not tested</p>
      </section>
      <section className="panel overflow-x-auto p-5">
        <h3 className="mb-3 font-semibold">By area</h3>
        <table className="data-table" data-testid="area-table">
          <thead><tr><th>Area</th><th className="text-right">Tested</th><th className="text-right">Failed</th><th className="text-right">Failure rate</th><th className="text-right">Steam lost</th><th className="text-right">Cost / yr</th><th className="text-right">CO2 t / yr</th></tr></thead>
          <tbody>
            {figures.byArea.map((a) => (
              <tr key={a.areaName}><td>{a.areaName}</td><td className="text-right">{a.tested} / {a.inService}</td><td className="text-right">{a.failed}</td><td className="text-right">{percent(a.failureRate)}</td>
                <td className="text-right">{quantity(a.lossKgPerHour, 'massFlow', units)}</td><td className="text-right">{money(a.costPerYear, settings.currency)}</td><td className="text-right">{a.co2TonnesPerYear.toFixed(1)}</td></tr>
            ))}
          </tbody>
        </table>
      </section>
      <section className="panel overflow-x-auto p-5">
        <h3 className="mb-3 font-semibold">Costliest failures</h3>
        {figures.failures.length === 0 ? <p className="text-sm text-ink-soft">No failed trap loses steam in this survey.</p> : (
          <table className="data-table" data-testid="costliest">
            <thead><tr><th>Trap</th><th>Area</th><th>Verdict</th><th className="text-right">Steam lost</th><th className="text-right">Cost / yr</th><th className="text-right">Orifice</th></tr></thead>
            <tbody>
              {figures.failures.slice(0, 20).map((f) => (
                <tr key={f.trapId}><td><Link className="tag-text text-accent-700 hover:underline" href={`/sites/${siteId}/traps/${f.trapId}`}>{f.tag}</Link></td><td>{f.areaName}</td>
                  <td><VerdictBadge code={f.verdict} muted={!f.decided} />{!f.decided && <span className="ml-1 text-xs text-ink-faint">suggested</span>}</td>
                  <td className="text-right">{quantity(f.kgPerHour, 'massFlow', units)}</td><td className="text-right">{money(f.costPerYear, settings.currency)}</td>
                  <td className="text-right text-ink-soft">{quantity(f.orificeMm, 'length', units, 1)}{f.orificeSource !== 'register' ? ' (default)' : ''}</td></tr>
              ))}
            </tbody>
          </table>
        )}
        <p className="mt-2 text-xs text-ink-faint">Failures that lose no steam (cold, backing up) are counted in the failure rate but not in the losses.</p>
      </section>
      {!frozen && may(actor, 'report.publish') && (
        <section className="panel p-5"><h3 className="mb-2 font-semibold">Publish</h3><PublishSurvey surveyId={surveyId} undecided={t.tested - t.decided} /></section>
      )}
    </div>
  );
}

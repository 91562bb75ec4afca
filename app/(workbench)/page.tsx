import Link from 'next/link';
import { SurveyStatusLabel } from '@/components/SurveyStatus';
import { may, requireActor } from '@/lib/auth/page';
import { listSitesFor } from '@/lib/services/sites';

export const metadata = { title: 'Sites' };

export default async function SitesOverviewPage() {
  const actor = await requireActor();
  const sites = await listSitesFor(actor);
  return (
    <div className="space-y-5">
      <div className="flex items-end justify-between">
        <div>
          <h1 className="page-title">Your sites</h1>
          <p className="text-sm text-ink-soft">
            {sites.length === 1 ? 'One site' : `${sites.length} sites`} you belong to. Open one to see its register and surveys.
          </p>
        </div>
        {may(actor, 'site.manage') && <Link href="/settings/sites" className="btn-quiet">Manage sites</Link>}
      </div>
      {sites.length === 0 && (
        <p className="panel p-6 text-sm text-ink-soft">You do not belong to any site yet. Ask an administrator to add you to one.</p>
      )}
      <ul className="grid gap-4 md:grid-cols-2">
        {sites.map((site) => {
          const current = site.surveys.find((s) => s.status === 'in_progress');
          const lastPublished = site.surveys.find((s) => s.status === 'published');
          return (
            <li key={site.id} className="panel p-5" data-testid="site-card">
              <Link href={`/sites/${site.id}`} className="text-lg font-semibold tracking-tight text-ink hover:text-accent-700">
                {site.name}
              </Link>
              <div className="text-xs text-ink-faint">{site.code} · {site.timeZone} · {site.currency}</div>
              <dl className="mt-4 grid grid-cols-3 gap-3 text-sm">
                <div><dt className="text-ink-soft">Traps registered</dt><dd className="text-xl font-semibold">{site.trapCount}</dd></div>
                <div><dt className="text-ink-soft">In service</dt><dd className="text-xl font-semibold">{site.inServiceCount}</dd></div>
                <div><dt className="text-ink-soft">Areas</dt><dd className="text-xl font-semibold">{site.areaCount}</dd></div>
              </dl>
              <div className="mt-4 space-y-1 border-t border-line pt-3 text-sm">
                {current ? (
                  <div className="flex items-center justify-between"><span>{current.name}</span><SurveyStatusLabel status={current.status} /></div>
                ) : (
                  <div className="text-ink-soft">No survey in progress.</div>
                )}
                {lastPublished && (
                  <div className="flex items-center justify-between text-ink-soft"><span>Last published: {lastPublished.name}</span><SurveyStatusLabel status={lastPublished.status} /></div>
                )}
              </div>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

import { SiteTabs } from '@/components/SiteTabs';
import { may, requireSiteActor } from '@/lib/auth/page';
import { getSite } from '@/lib/services/sites';

export default async function SiteLayout({ children, params }: { children: React.ReactNode; params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId);
  const site = await getSite(siteId);
  const base = `/sites/${siteId}`;
  const tabs = [
    { href: base, label: 'Overview' },
    { href: `${base}/traps`, label: 'Trap register' },
    { href: `${base}/areas`, label: 'Areas' },
    { href: `${base}/surveys`, label: 'Surveys' },
    ...(may(actor, 'upload.read') ? [{ href: `${base}/uploads`, label: 'Uploads' }] : []),
    { href: `${base}/work-orders`, label: 'Work orders' },
    { href: `${base}/costs`, label: 'Costs' },
    ...(may(actor, 'register.import') ? [{ href: `${base}/register-import`, label: 'Import register' }] : []),
  ];
  return (
    <div className="space-y-5">
      <div>
        <div className="text-xs uppercase tracking-wide text-ink-faint">Site · {site.code}</div>
        <h1 className="page-title">{site.name}</h1>
      </div>
      <SiteTabs tabs={tabs} />
      {children}
    </div>
  );
}

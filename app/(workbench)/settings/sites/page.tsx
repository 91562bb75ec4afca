import { SiteSettings } from '@/components/settings/SiteSettings';
import { requirePermission } from '@/lib/auth/page';
import { listSitesFor } from '@/lib/services/sites';

export const metadata = { title: 'Sites' };

export default async function SiteSettingsPage() {
  const actor = await requirePermission('site.manage');
  return <SiteSettings sites={await listSitesFor(actor)} />;
}

import { CostSettingsForm } from '@/components/outcomes/CostSettingsForm';
import { may, requireSiteActor } from '@/lib/auth/page';
import { getCostSettings } from '@/lib/services/outcomes';

export const metadata = { title: 'Cost settings' };

export default async function CostSettingsPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'site.read');
  const settings = await getCostSettings(siteId);
  return (
    <div className="max-w-4xl space-y-3">
      <h2 className="text-lg font-semibold">Cost and emission settings</h2>
      {settings.isDefault && <p className="text-sm text-ink-soft">These are the defaults: no steam or fuel price is set yet, so costs show as unknown.</p>}
      <CostSettingsForm siteId={siteId} settings={settings} canEdit={may(actor, 'settings.cost')} />
    </div>
  );
}

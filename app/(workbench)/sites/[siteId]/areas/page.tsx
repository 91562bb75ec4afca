import { AreaManager } from '@/components/register/AreaManager';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';

export const metadata = { title: 'Areas' };

export default async function AreasPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'register.read');
  return <AreaManager siteId={siteId} areas={await listAreas(siteId)} canEdit={may(actor, 'area.write')} />;
}

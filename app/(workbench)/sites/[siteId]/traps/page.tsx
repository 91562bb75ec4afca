import { TrapRegisterTable } from '@/components/register/TrapRegisterTable';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';

export const metadata = { title: 'Trap register' };

export default async function TrapRegisterPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'register.read');
  const areas = await listAreas(siteId);
  return <TrapRegisterTable siteId={siteId} areas={areas.map((a) => ({ id: a.id, name: a.name }))} canEdit={may(actor, 'trap.write')} />;
}

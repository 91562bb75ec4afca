import { TrapForm } from '@/components/register/TrapForm';
import { requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';
import { trapForPage } from '../trap-for-page';

export const metadata = { title: 'Edit trap' };

export default async function EditTrapPage({ params }: { params: Promise<{ siteId: string; trapId: string }> }) {
  const { siteId: rawSiteId, trapId } = await params;
  const { siteId } = await requireSiteActor(rawSiteId, 'trap.write');
  const [trap, areas] = await Promise.all([trapForPage(siteId, trapId), listAreas(siteId)]);
  return (
    <div className="max-w-3xl space-y-3">
      <h2 className="text-lg font-semibold">Edit <span className="tag-text">{trap.tag}</span></h2>
      <TrapForm siteId={siteId} areas={areas} trap={trap} />
    </div>
  );
}

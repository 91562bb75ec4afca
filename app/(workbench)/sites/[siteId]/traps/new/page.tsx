import { TrapForm } from '@/components/register/TrapForm';
import { requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';

export const metadata = { title: 'Add trap' };

export default async function NewTrapPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await requireSiteActor((await params).siteId, 'trap.write');
  const areas = await listAreas(siteId);
  return (
    <div className="max-w-3xl space-y-3">
      <h2 className="text-lg font-semibold">Add a trap to the register</h2>
      <TrapForm siteId={siteId} areas={areas} />
    </div>
  );
}

import Link from 'next/link';
import type { Actor } from '@/lib/auth/actor';
import { listWorkOrders } from '@/lib/services/work-orders';
import { WorkOrderTable } from './WorkOrderTable';

/** The trap page's section: every work order of this trap, across surveys. */
export async function TrapWorkOrders({ actor, siteId, trapId }: { actor: Actor; siteId: number; trapId: number }) {
  const { items } = await listWorkOrders(actor, siteId, { trapId });
  return (
    <section className="panel" data-testid="trap-work-orders">
      <div className="flex items-center justify-between p-5 pb-2">
        <h3 className="font-semibold">Work orders</h3>
        <Link href={`/sites/${siteId}/work-orders`} className="text-sm text-accent-700 hover:underline">All work orders</Link>
      </div>
      <div className="overflow-x-auto"><WorkOrderTable orders={items} siteId={siteId} showTrap={false} /></div>
    </section>
  );
}

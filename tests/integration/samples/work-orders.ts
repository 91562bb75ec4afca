import type { WORK_ORDER_ROUTES } from '@/lib/api/work-order-routes';
import type { SiteIds } from '../../support/fixtures';
import { type Client, unique } from '../../support/http';
import type { Sample } from './sample';

/**
 * A published survey of the site with confirmed failures (the demo seed's; surveys other tests
 * publish may have none), newest first.
 */
export async function publishedSurveyOf(admin: Client, siteId: number): Promise<number> {
  const surveys = (await admin.get(`/api/sites/${siteId}/surveys`)).body.items as { id: number; status: string; startsOn: string }[];
  for (const survey of surveys.filter((s) => s.status === 'published').sort((a, b) => b.startsOn.localeCompare(a.startsOn))) {
    if ((await admin.get(`/api/surveys/${survey.id}/work-order-candidates`)).body.items.length) return survey.id;
  }
  throw new Error(`Site ${siteId} has no published survey with confirmed failures.`);
}

/**
 * A confirmed failure without an active work order, newest published survey first, then the older
 * ones: the demo seed's confirmed failures are the pool every run of the tests draws from.
 */
export async function freeCandidate(admin: Client, siteId: number) {
  const surveys = (await admin.get(`/api/sites/${siteId}/surveys`)).body.items as { id: number; status: string; startsOn: string }[];
  for (const survey of surveys.filter((s) => s.status === 'published').sort((a, b) => b.startsOn.localeCompare(a.startsOn))) {
    const candidates = (await admin.get(`/api/surveys/${survey.id}/work-order-candidates`)).body;
    const free = (candidates.items as { trapId: number; tag: string; order: unknown }[]).find((c) => !c.order);
    if (free) return { surveyId: survey.id, trapId: free.trapId, tag: free.tag, technicianId: (candidates.technicians[0] as { id: number } | undefined)?.id ?? null };
  }
  throw new Error(`No confirmed failure without a work order is left in the published surveys of site ${siteId}.`);
}

/** A new work order on a confirmed failure that has none yet; scheduled if asked and the site has a technician. */
export async function freshWorkOrder(client: Client, siteId: number, scheduled = false) {
  const free = await freeCandidate(client, siteId);
  const plan = scheduled && free.technicianId ? { assigneeId: free.technicianId, dueOn: '2030-01-31' } : {};
  const made = await client.post(`/api/surveys/${free.surveyId}/work-orders`, { items: [{ trapId: free.trapId, action: 'repair', ...plan }] });
  if (made.status !== 201) throw new Error(`work order: ${made.status} ${JSON.stringify(made.body)}`);
  return made.body.items[0] as { id: number; trapId: number; status: string };
}

const plain = new Map<number, Promise<{ id: number }>>();
const reusable = (admin: Client, s: SiteIds) => {
  if (!plain.has(s.siteId)) plain.set(s.siteId, freshWorkOrder(admin, s.siteId));
  return plain.get(s.siteId)!;
};

async function someMessage(admin: Client): Promise<number> {
  const deadline = Date.now() + 10_000;
  let list = (await admin.get('/api/mailbox')).body;
  if (!list.total) await admin.post('/api/invitations', { email: `${unique('mailbox')}@plumeward.example`.toLowerCase(), name: 'Mailbox sample', role: 'viewer', siteIds: [] });
  while (!list.total) {
    if (Date.now() > deadline) throw new Error('The catcher received nothing.');
    await new Promise((r) => setTimeout(r, 100));
    list = (await admin.get('/api/mailbox')).body;
  }
  return list.items[0].id;
}

export const WORK_ORDER_SAMPLES: Record<keyof typeof WORK_ORDER_ROUTES, Sample> = {
  listWorkOrders: (s) => ({ params: { siteId: s.siteId } }),
  workOrderCandidates: async (s, { admin }) => ({ params: { surveyId: await publishedSurveyOf(admin, s.siteId) } }),
  createWorkOrders: async (s, { admin }) => {
    const free = await freeCandidate(admin, s.siteId);
    return { params: { surveyId: free.surveyId }, body: { items: [{ trapId: free.trapId, action: 'repair' }] } };
  },
  getWorkOrder: async (s, { admin }) => ({ params: { workOrderId: (await reusable(admin, s)).id } }),
  updateWorkOrder: async (s, { admin }) => ({ params: { workOrderId: (await reusable(admin, s)).id }, body: { notes: unique('planned') } }),
  completeWorkOrder: async (s, { admin }) => ({ params: { workOrderId: (await freshWorkOrder(admin, s.siteId, true)).id }, body: { repairCost: 140, notes: 'New disc and seat.' } }),
  sendWorkOrderReminders: () => ({ params: {} }),
  listMail: () => ({ params: {} }),
  getMail: async (_s, { admin }) => ({ params: { messageId: await someMessage(admin) } }),
  listInvitations: () => ({ params: {} }),
  createInvitation: () => ({ params: {}, body: { email: `${unique('invitee')}@plumeward.example`.toLowerCase(), name: 'Invited', role: 'viewer', siteIds: [] } }),
};

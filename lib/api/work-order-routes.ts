// Part of the route list (lib/api/routes.ts joins it in): repair work orders, the development
// mailbox and invitations. The input schemas live here beside their routes and are exported for
// the forms that send them (one schema per input).
import { z } from 'zod';
import { ROLES } from '@/lib/domain/vocabulary';
import { idSchema, isoDateSchema } from '@/lib/validation/common';
import { passwordSchema } from '@/lib/validation/user';
import { defineRoute, type RouteSpec } from './spec';

export const WORK_ORDER_ACTION_CODES = ['repair', 'replace', 'clean_strainer', 'retest'] as const;
export const WORK_ORDER_ACTION_LABELS: Record<(typeof WORK_ORDER_ACTION_CODES)[number], string> = {
  repair: 'Repair', replace: 'Replace', clean_strainer: 'Clean strainer', retest: 'Re-test',
};
export const WORK_ORDER_STATUS_CODES = ['open', 'scheduled', 'done', 'verified', 'reopened'] as const;
export const WORK_ORDER_STATUS_LABELS: Record<(typeof WORK_ORDER_STATUS_CODES)[number], string> = {
  open: 'Open', scheduled: 'Scheduled', done: 'Done — awaiting re-test', verified: 'Verified by re-test', reopened: 'Re-opened: re-test failed',
};
export const WORK_ORDER_PRIORITY_CODES = ['urgent', 'high', 'normal', 'low'] as const;
export const WORK_ORDER_PRIORITY_LABELS: Record<(typeof WORK_ORDER_PRIORITY_CODES)[number], string> = {
  urgent: 'Urgent', high: 'High', normal: 'Normal', low: 'Low',
};

const dueOn = isoDateSchema.nullable().optional().describe('the day the work is due (YYYY-MM-DD); an order with an assignee and a due date is scheduled');
const cost = z.number().min(0, 'A cost is not negative.').max(1e9).nullable().optional();

export const workOrderCreateSchema = z.object({
  items: z.array(z.object({
    trapId: idSchema,
    action: z.enum(WORK_ORDER_ACTION_CODES).default('repair'),
    assigneeId: idSchema.nullable().optional(),
    dueOn,
  })).min(1, 'Pick at least one failed trap.').max(500),
});
export type WorkOrderCreateInput = z.output<typeof workOrderCreateSchema>;

export const workOrderUpdateSchema = z.object({
  action: z.enum(WORK_ORDER_ACTION_CODES).optional(),
  assigneeId: idSchema.nullable().optional(),
  dueOn,
  notes: z.string().trim().max(4000).nullable().optional(),
  status: z.enum(WORK_ORDER_STATUS_CODES).optional().describe('open ⇄ scheduled here; done through the done route; verified and re-opened only by a re-test'),
});
export type WorkOrderUpdateInput = z.output<typeof workOrderUpdateSchema>;

export const workOrderDoneSchema = z.object({
  repairCost: cost.describe("what the repair cost, in the site's currency"),
  notes: z.string().trim().max(4000).nullable().optional(),
});
export type WorkOrderDoneInput = z.output<typeof workOrderDoneSchema>;

export const workOrderListQuery = z.object({
  status: z.enum(WORK_ORDER_STATUS_CODES).optional(),
  surveyId: idSchema.optional(),
  trapId: idSchema.optional(),
  mine: z.enum(['true', 'false']).optional().transform((v) => v === 'true').describe('only orders assigned to the caller'),
});

export const invitationInputSchema = z.object({
  email: z.string().trim().toLowerCase().email('Not an e-mail address.'),
  name: z.string().trim().min(1, 'A name is required.').max(120),
  role: z.enum(ROLES),
  siteIds: z.array(idSchema).default([]),
});
export type InvitationInput = z.output<typeof invitationInputSchema>;

export const invitationAcceptSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
  confirm: z.string(),
}).refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

const workOrder = z.object({
  id: z.number(), siteId: z.number(), surveyId: z.number(), surveyName: z.string(), trapId: z.number(), tag: z.string(),
  areaName: z.string().nullable(), location: z.string().nullable(), application: z.string().nullable(), criticality: z.string(),
  verdict: z.string().nullable(), action: z.enum(WORK_ORDER_ACTION_CODES), priority: z.enum(WORK_ORDER_PRIORITY_CODES),
  priorityReason: z.string().nullable(), assigneeId: z.number().nullable(), assigneeName: z.string().nullable(),
  dueOn: z.string().nullable(), overdue: z.boolean(), status: z.enum(WORK_ORDER_STATUS_CODES),
  lossKgPerHour: z.number().nullable(), costPerYear: z.number().nullable(), currency: z.string(), repairCost: z.number().nullable(),
  notes: z.string().nullable(), doneAt: z.string().nullable(), doneBy: z.string().nullable(), verifiedByTestId: z.number().nullable(),
  verifiedAt: z.string().nullable(), remindedAt: z.string().nullable(), createdAt: z.string(), updatedAt: z.string(),
});
const candidate = z.object({
  trapId: z.number(), tag: z.string(), areaName: z.string().nullable(), location: z.string().nullable(), application: z.string().nullable(),
  criticality: z.string(), verdict: z.string(), kgPerHour: z.number().nullable(), tonnesPerYear: z.number().nullable(), costPerYear: z.number().nullable(),
  priority: z.enum(WORK_ORDER_PRIORITY_CODES), priorityReason: z.string(),
  order: z.object({ id: z.number(), status: z.enum(WORK_ORDER_STATUS_CODES) }).nullable().describe('an order of this survey not yet verified'),
});
const person = z.object({ id: z.number(), name: z.string(), email: z.string() });
const trailEvent = z.object({ id: z.number(), action: z.string(), at: z.string(), by: z.string(), before: z.unknown(), after: z.unknown(), reason: z.string().nullable() });
const mailEntry = z.object({ id: z.number(), receivedAt: z.string(), from: z.string(), to: z.array(z.string()), subject: z.string() });
const invitation = z.object({
  id: z.number(), email: z.string(), name: z.string(), role: z.enum(ROLES), siteIds: z.array(z.number()), expiresAt: z.string(),
  state: z.enum(['pending', 'accepted', 'expired', 'revoked']), createdAt: z.string(), mailed: z.boolean().optional(),
});

const siteParams = z.object({ siteId: idSchema });
const surveyParams = z.object({ surveyId: idSchema });
const orderParams = z.object({ workOrderId: idSchema });

export const WORK_ORDER_ROUTES = {
  listWorkOrders: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/work-orders', permission: 'survey.read', tag: 'Work orders',
    summary: "A site's work orders, most urgent and oldest due first", params: siteParams, query: workOrderListQuery,
    response: z.object({ items: z.array(workOrder) }),
  }),
  workOrderCandidates: defineRoute({
    method: 'GET', path: '/api/surveys/{surveyId}/work-order-candidates', permission: 'workorder.plan', tag: 'Work orders',
    summary: "A survey's confirmed failures, costliest first, with the priority each would get and the site's technicians",
    params: surveyParams,
    response: z.object({ surveyId: z.number(), surveyName: z.string(), currency: z.string(), items: z.array(candidate), technicians: z.array(person) }),
  }),
  createWorkOrders: defineRoute({
    method: 'POST', path: '/api/surveys/{surveyId}/work-orders', permission: 'workorder.plan', tag: 'Work orders', status: 201,
    summary: 'Turn confirmed failures of a survey into work orders (one or many); the assignees are e-mailed',
    params: surveyParams, body: workOrderCreateSchema, response: z.object({ items: z.array(workOrder) }),
  }),
  getWorkOrder: defineRoute({
    method: 'GET', path: '/api/work-orders/{workOrderId}', permission: 'survey.read', tag: 'Work orders',
    summary: 'One work order with its trail', params: orderParams, response: workOrder.extend({ trail: z.array(trailEvent) }),
  }),
  updateWorkOrder: defineRoute({
    method: 'PATCH', path: '/api/work-orders/{workOrderId}', permission: 'workorder.plan', tag: 'Work orders',
    summary: 'Plan or edit a work order: action, assignee (e-mailed), due date, notes, open ⇄ scheduled; 409 for a transition the rules refuse',
    params: orderParams, body: workOrderUpdateSchema, response: workOrder,
  }),
  completeWorkOrder: defineRoute({
    method: 'POST', path: '/api/work-orders/{workOrderId}/done', permission: 'workorder.record', tag: 'Work orders',
    summary: 'Mark a scheduled (or re-opened) work order done, with the repair cost and notes; a later re-test verifies it',
    params: orderParams, body: workOrderDoneSchema, response: workOrder,
  }),
  sendWorkOrderReminders: defineRoute({
    method: 'POST', path: '/api/work-orders/reminders', permission: 'workorder.plan', tag: 'Work orders',
    summary: 'Send the overdue reminders now (the server also does so on an interval; at most one per order per day)',
    response: z.object({ sent: z.number(), workOrderIds: z.array(z.number()) }),
  }),
  listMail: defineRoute({
    method: 'GET', path: '/api/mailbox', permission: 'mailbox.read', tag: 'Development mailbox',
    summary: 'What the local SMTP catcher received, newest first', query: z.object({ to: z.string().max(254).optional() }),
    response: z.object({ items: z.array(mailEntry), total: z.number() }),
  }),
  getMail: defineRoute({
    method: 'GET', path: '/api/mailbox/{messageId}', permission: 'mailbox.read', tag: 'Development mailbox',
    summary: 'One caught message with its text and HTML', params: z.object({ messageId: idSchema }),
    response: mailEntry.extend({ text: z.string(), html: z.string().nullable(), envelope: z.object({ from: z.string(), to: z.array(z.string()) }) }),
  }),
  listInvitations: defineRoute({
    method: 'GET', path: '/api/invitations', permission: 'user.manage', tag: 'Users',
    summary: 'Invitations sent, newest first', response: z.object({ items: z.array(invitation) }),
  }),
  createInvitation: defineRoute({
    method: 'POST', path: '/api/invitations', permission: 'user.manage', tag: 'Users', status: 201,
    summary: 'Invite a user by e-mail: a single-use link that expires (the token is e-mailed, only its hash is kept)',
    body: invitationInputSchema, response: invitation,
  }),
} as const satisfies Record<string, RouteSpec>;

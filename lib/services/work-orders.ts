import 'server-only';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { FAILED_VERDICTS, isVerdictCode, VERDICT_LABELS, type VerdictCode } from '@/lib/analysis/verdict-codes';
import {
  WORK_ORDER_ACTION_LABELS, WORK_ORDER_PRIORITY_LABELS,
  type WorkOrderCreateInput, type WorkOrderDoneInput, type WorkOrderUpdateInput,
} from '@/lib/api/work-order-routes';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import { appUrl } from '@/lib/mail/config';
import { assignmentMail, reminderMail, type WorkOrderMailInput } from '@/lib/mail/messages';
import { sendMail } from '@/lib/mail/transport';
import { priorityRank, workOrderPriority } from '@/lib/outcomes/work-order-priority';
import { Area, Site, SiteMembership, Survey, Test, Trap, TrapVerdict, Upload, User, WorkOrder } from '@/models';
import type { WorkOrderStatus } from '@/models/WorkOrder';
import { auditTrail, recordAudit } from './audit';
import { surveySummary } from './outcomes';

// Work orders (BRIEF §3, issue 6): a survey's confirmed failures become repair jobs.
// Status rules, in one place:
//   open       — made, not yet planned: no assignee or no due date
//   scheduled  — a technician and a due date are set (set both and it is scheduled; clear one and it is open)
//   done       — the technician has done the work (from scheduled, or from re-opened after a failed re-test)
//   verified   — a later trap-point test of the trap, taken after the work was done, suggests working
//   reopened   — that re-test still finds the trap failed: the work is to be done again
// Only a re-test verifies or re-opens; a verified order is closed.

const ACTIVE: WorkOrderStatus[] = ['open', 'scheduled', 'done', 'reopened'];
const ASSIGNABLE: WorkOrderStatus[] = ['open', 'scheduled', 'reopened'];

type OrderRow = WorkOrder & {
  trap?: Trap & { area?: Area | null };
  survey?: Survey;
  assignee?: User | null;
};

/** The calendar date of a moment in a time zone, as YYYY-MM-DD. */
export function localDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

const daysBetween = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);

const include = [
  { model: Trap, as: 'trap', attributes: ['id', 'tag', 'location', 'application', 'criticality', 'areaId'], include: [{ model: Area, as: 'area', attributes: ['name'] }] },
  { model: Survey, as: 'survey', attributes: ['id', 'name'] },
  { model: User, as: 'assignee', attributes: ['id', 'name', 'email'] },
];

async function namesOf(ids: (number | null)[]) {
  const wanted = [...new Set(ids.filter((i): i is number => i != null))];
  if (!wanted.length) return new Map<number, string>();
  return new Map((await User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
}

function dto(o: OrderRow, site: Site, names: Map<number, string>) {
  const active = o.status === 'open' || o.status === 'scheduled' || o.status === 'reopened';
  return {
    id: o.id, siteId: o.siteId, surveyId: o.surveyId, surveyName: o.survey?.name ?? '', trapId: o.trapId, tag: o.trap?.tag ?? '',
    areaName: o.trap?.area?.name ?? null, location: o.trap?.location ?? null, application: o.trap?.application ?? null,
    criticality: o.trap?.criticality ?? 'normal', verdict: o.verdict, action: o.action, priority: o.priority,
    priorityReason: o.priorityReason, assigneeId: o.assigneeId ?? null, assigneeName: o.assignee?.name ?? null,
    dueOn: o.dueOn, overdue: active && !!o.dueOn && o.dueOn < localDate(new Date(), site.timeZone), status: o.status,
    lossKgPerHour: o.lossKgPerHour, costPerYear: o.costPerYear, currency: site.currency, repairCost: o.repairCost, notes: o.notes,
    doneAt: o.doneAt?.toISOString() ?? null, doneBy: o.doneBy ? names.get(o.doneBy) ?? null : null,
    verifiedByTestId: o.verifiedByTestId ?? null, verifiedAt: o.verifiedAt?.toISOString() ?? null,
    remindedAt: o.remindedAt?.toISOString() ?? null, createdAt: o.createdAt.toISOString(), updatedAt: o.updatedAt.toISOString(),
  };
}
export type WorkOrderDto = ReturnType<typeof dto>;

async function dtos(orders: OrderRow[]): Promise<WorkOrderDto[]> {
  const sites = new Map((await Site.findAll({ where: { id: { [Op.in]: [...new Set(orders.map((o) => o.siteId))] } } })).map((s) => [s.id, s]));
  const names = await namesOf(orders.map((o) => o.doneBy ?? null));
  return orders.map((o) => dto(o, sites.get(o.siteId)!, names));
}

async function load(id: number, transaction?: Transaction): Promise<OrderRow> {
  const order = (await WorkOrder.findByPk(id, { include, transaction })) as OrderRow | null;
  if (!order) throw notFound('work order');
  return order;
}

const snapshot = (o: WorkOrder) => ({
  status: o.status, action: o.action, priority: o.priority, assigneeId: o.assigneeId, dueOn: o.dueOn,
  repairCost: o.repairCost, notes: o.notes, verifiedByTestId: o.verifiedByTestId,
});

export async function siteIdOfWorkOrder(id: number): Promise<number | null> {
  return (await WorkOrder.findByPk(id, { attributes: ['siteId'] }))?.siteId ?? null;
}

export async function listWorkOrders(actor: Actor, siteId: number, filter: { status?: WorkOrderStatus; surveyId?: number; trapId?: number; mine?: boolean }) {
  const orders = (await WorkOrder.findAll({
    where: {
      siteId,
      ...(filter.status ? { status: filter.status } : {}),
      ...(filter.surveyId ? { surveyId: filter.surveyId } : {}),
      ...(filter.trapId ? { trapId: filter.trapId } : {}),
      ...(filter.mine ? { assigneeId: actor.userId } : {}),
    },
    include,
  })) as OrderRow[];
  const items = await dtos(orders);
  const closed = (s: string) => (s === 'verified' ? 2 : s === 'done' ? 1 : 0);
  items.sort((a, b) => closed(a.status) - closed(b.status) || priorityRank(a.priority) - priorityRank(b.priority)
    || (a.dueOn ?? '9999').localeCompare(b.dueOn ?? '9999') || a.id - b.id);
  return { items };
}

export async function getWorkOrder(id: number) {
  const [order] = await dtos([await load(id)]);
  return { ...order, trail: await auditTrail('work_order', id) };
}

/** The active technicians who belong to a site: who may be assigned its work orders. */
export async function techniciansOf(siteId: number) {
  const members = await SiteMembership.findAll({ where: { siteId }, attributes: ['userId'] });
  const users = await User.findAll({
    where: { id: { [Op.in]: members.map((m) => m.userId) }, role: 'technician', status: 'active' },
    attributes: ['id', 'name', 'email'], order: [['name', 'ASC']],
  });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email }));
}

async function assertAssignable(siteId: number, assigneeId: number | null | undefined, path: string) {
  if (assigneeId == null) return;
  if (!(await techniciansOf(siteId)).some((t) => t.id === assigneeId)) {
    throw new AppError('invalid', 'Invalid request body.', [{ path, message: 'Not an active technician of this site.' }]);
  }
}

/**
 * A survey's confirmed failures (the analyst's verdict, confirmed or overridden, is failed), costliest
 * first, with the loss and cost of the survey's figures and the priority an order would get.
 */
export async function workOrderCandidates(surveyId: number) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  const site = (await Site.findByPk(survey.siteId))!;
  const [summary, decisions, orders] = await Promise.all([
    surveySummary(surveyId),
    TrapVerdict.findAll({ where: { surveyId, state: { [Op.in]: ['confirmed', 'overridden'] } } }),
    WorkOrder.findAll({ where: { surveyId, status: { [Op.in]: ACTIVE } }, attributes: ['id', 'trapId', 'status'] }),
  ]);
  const failed = decisions.filter((d) => isVerdictCode(d.verdict) && FAILED_VERDICTS.has(d.verdict as VerdictCode));
  const traps = new Map((await Trap.findAll({
    where: { id: { [Op.in]: failed.map((d) => d.trapId) }, status: { [Op.ne]: 'removed' } },
    include: [{ model: Area, as: 'area', attributes: ['name'] }],
  })).map((t) => [t.id, t]));
  const figureOf = new Map(summary.figures.failures.map((f) => [f.trapId, f]));
  const orderOf = new Map(orders.map((o) => [o.trapId, { id: o.id, status: o.status }]));
  const items = failed.filter((d) => traps.has(d.trapId)).map((d) => {
    const trap = traps.get(d.trapId)! as Trap & { area?: Area | null };
    const f = figureOf.get(trap.id);
    const verdict = d.verdict as VerdictCode;
    const p = workOrderPriority({
      verdict, application: trap.application ?? null, criticality: trap.criticality,
      costPerYear: f?.costPerYear ?? (f ? null : 0), kgPerHour: f?.kgPerHour ?? 0, currency: site.currency,
    });
    return {
      trapId: trap.id, tag: trap.tag, areaName: trap.area?.name ?? null, location: trap.location ?? null, application: trap.application ?? null,
      criticality: trap.criticality, verdict, kgPerHour: f?.kgPerHour ?? null, tonnesPerYear: f?.tonnesPerYear ?? null,
      costPerYear: f?.costPerYear ?? null, priority: p.priority, priorityReason: p.reason, order: orderOf.get(trap.id) ?? null,
    };
  });
  items.sort((a, b) => priorityRank(a.priority) - priorityRank(b.priority) || (b.costPerYear ?? b.kgPerHour ?? 0) - (a.costPerYear ?? a.kgPerHour ?? 0) || a.tag.localeCompare(b.tag));
  return { surveyId, surveyName: survey.name, currency: site.currency, items, technicians: await techniciansOf(site.id) };
}

function mailInput(o: OrderRow, site: Site): WorkOrderMailInput {
  return {
    to: o.assignee!.email, assigneeName: o.assignee!.name, workOrderId: o.id,
    url: `${appUrl()}/sites/${site.id}/work-orders/${o.id}`, siteName: site.name, tag: o.trap?.tag ?? '',
    areaName: o.trap?.area?.name ?? null, location: o.trap?.location ?? null,
    verdictLabel: isVerdictCode(o.verdict) ? VERDICT_LABELS[o.verdict as VerdictCode] : 'failed',
    actionLabel: WORK_ORDER_ACTION_LABELS[o.action], priorityLabel: WORK_ORDER_PRIORITY_LABELS[o.priority],
    priorityReason: o.priorityReason, dueOn: o.dueOn, surveyName: o.survey?.name ?? '',
  };
}

async function mailAssignees(orderIds: number[]) {
  for (const id of orderIds) {
    const o = await load(id);
    if (!o.assignee) continue;
    await sendMail(assignmentMail(mailInput(o, (await Site.findByPk(o.siteId))!)));
  }
}

const plannedStatus = (assigneeId: number | null | undefined, dueOn: string | null | undefined): WorkOrderStatus =>
  assigneeId && dueOn ? 'scheduled' : 'open';

/** Turns confirmed failures into work orders, all or none; each assignee is e-mailed afterwards. */
export async function createWorkOrders(actor: Actor, surveyId: number, input: WorkOrderCreateInput) {
  const candidates = await workOrderCandidates(surveyId);
  const survey = (await Survey.findByPk(surveyId))!;
  const byTrap = new Map(candidates.items.map((c) => [c.trapId, c]));
  const issues: { path: string; message: string }[] = [];
  const seen = new Set<number>();
  input.items.forEach((item, i) => {
    const c = byTrap.get(item.trapId);
    if (!c) issues.push({ path: `items.${i}.trapId`, message: 'Not a confirmed failure of this survey: confirm its verdict in the review queue first.' });
    else if (seen.has(item.trapId)) issues.push({ path: `items.${i}.trapId`, message: `${c.tag} is picked twice.` });
    seen.add(item.trapId);
  });
  if (issues.length) throw new AppError('invalid', 'Some picked traps cannot become work orders.', issues);
  const taken = input.items.map((item) => byTrap.get(item.trapId)!).filter((c) => c.order);
  if (taken.length) {
    throw new AppError('conflict', `${taken.map((c) => `${c.tag} already has work order #${c.order!.id} (${c.order!.status})`).join('; ')}. Edit that order instead.`);
  }
  for (const [i, item] of input.items.entries()) await assertAssignable(survey.siteId, item.assigneeId, `items.${i}.assigneeId`);
  const ids = await writeTransaction(async (transaction) => {
    const made: number[] = [];
    for (const item of input.items) {
      const c = byTrap.get(item.trapId)!;
      const order = await WorkOrder.create({
        siteId: survey.siteId, surveyId, trapId: c.trapId, verdict: c.verdict, action: item.action, priority: c.priority,
        priorityReason: c.priorityReason, assigneeId: item.assigneeId ?? null, dueOn: item.dueOn ?? null,
        status: plannedStatus(item.assigneeId, item.dueOn), lossKgPerHour: c.kgPerHour, costPerYear: c.costPerYear,
        repairCost: null, notes: null, doneAt: null, doneBy: null, verifiedByTestId: null, verifiedAt: null, remindedAt: null,
        createdBy: actor.userId,
      }, { transaction }).catch((err) => {
        // Another instance made an order for this trap since the check above (work_orders_one_active).
        if (err instanceof UniqueConstraintError) throw new AppError('conflict', `${c.tag} got a work order meanwhile. Reload the plan and edit that order instead.`);
        throw err;
      });
      await recordAudit(actor, {
        siteId: survey.siteId, action: 'workorder.create', entityType: 'work_order', entityId: order.id,
        after: { ...snapshot(order), trapId: c.trapId, tag: c.tag, verdict: c.verdict, priorityReason: c.priorityReason },
      }, transaction);
      made.push(order.id);
    }
    return made;
  });
  await mailAssignees(ids);
  return { items: await dtos(await Promise.all(ids.map((id) => load(id)))) };
}

function refuse(message: string): never {
  throw new AppError('conflict', message);
}

/** Planning edits by an analyst; the status rules above decide which changes are allowed. */
export async function updateWorkOrder(actor: Actor, id: number, input: WorkOrderUpdateInput) {
  const current = await load(id);
  if (current.status === 'verified') refuse(`Work order #${id} is verified by a re-test and closed; make a new work order if the trap fails again.`);
  const planning = input.action !== undefined || input.assigneeId !== undefined || input.dueOn !== undefined;
  if (current.status === 'done' && (planning || (input.status && input.status !== 'done'))) {
    refuse(`Work order #${id} is done and waits for its re-test; the re-test verifies or re-opens it.`);
  }
  if (input.status === 'done' && current.status !== 'done') refuse('Mark the work done with "Mark done" (POST /api/work-orders/{id}/done), with the repair cost and notes.');
  if (input.status === 'verified') refuse('Only a passing re-test verifies a work order: upload a test of the trap taken after the work was done.');
  if (input.status === 'reopened' && current.status !== 'reopened') refuse('Only a failing re-test re-opens a work order.');
  await assertAssignable(current.siteId, input.assigneeId, 'assigneeId');
  const assigneeId = input.assigneeId !== undefined ? input.assigneeId : current.assigneeId;
  const dueOn = input.dueOn !== undefined ? input.dueOn : current.dueOn;
  let status: WorkOrderStatus = current.status;
  if (input.status === 'scheduled' && !(assigneeId && dueOn)) refuse('A work order is scheduled once it has a technician and a due date: set both first.');
  if (input.status === 'open' && current.status === 'reopened') refuse('A re-opened work order stays re-opened until the work is done again; change its technician or due date instead.');
  if (ASSIGNABLE.includes(current.status) && current.status !== 'reopened') status = input.status === 'open' ? 'open' : plannedStatus(assigneeId, dueOn);
  const newAssignee = assigneeId != null && assigneeId !== current.assigneeId;
  await writeTransaction(async (transaction) => {
    const order = (await WorkOrder.findByPk(id, { transaction }))!;
    const before = snapshot(order);
    await order.update({
      ...(input.action ? { action: input.action } : {}), assigneeId, dueOn, status,
      ...(input.notes !== undefined ? { notes: input.notes || null } : {}),
      ...(input.dueOn !== undefined ? { remindedAt: null } : {}),
    }, { transaction });
    await recordAudit(actor, { siteId: order.siteId, action: 'workorder.update', entityType: 'work_order', entityId: id, before, after: snapshot(order) }, transaction);
  });
  if (newAssignee) await mailAssignees([id]);
  const [order] = await dtos([await load(id)]);
  return order;
}

/** The technician's record of the work: scheduled (or re-opened) → done, with cost and notes. */
export async function completeWorkOrder(actor: Actor, id: number, input: WorkOrderDoneInput) {
  await writeTransaction(async (transaction) => {
    const order = (await WorkOrder.findByPk(id, { transaction }))!;
    if (!order) throw notFound('work order');
    if (order.status === 'open') refuse(`Work order #${id} is not scheduled yet: an analyst assigns a technician and a due date first.`);
    if (order.status === 'done') refuse(`Work order #${id} is already done (${order.doneAt?.toISOString().slice(0, 10)}); it waits for its re-test.`);
    if (order.status === 'verified') refuse(`Work order #${id} is verified by a re-test and closed.`);
    const before = snapshot(order);
    await order.update({
      status: 'done', doneAt: new Date(), doneBy: actor.userId,
      repairCost: input.repairCost ?? order.repairCost, notes: input.notes ?? order.notes,
    }, { transaction });
    await recordAudit(actor, { siteId: order.siteId, action: 'workorder.done', entityType: 'work_order', entityId: id, before, after: snapshot(order) }, transaction);
  });
  const [order] = await dtos([await load(id)]);
  return order;
}

/**
 * After an upload: each trap-point test in it of a trap with a done work order, taken after the
 * work was done and uploaded after it, decides that order — working verifies it, a failed verdict
 * re-opens it; any other verdict (inconclusive, background noise…) leaves it waiting. The latest
 * such test of a trap decides. Called at the end of processUpload.
 */
export async function settleWorkOrdersAfterUpload(uploadId: number) {
  const upload = await Upload.findByPk(uploadId, { attributes: ['id', 'siteId', 'createdAt'] });
  if (!upload) return [];
  const tests = await Test.findAll({
    where: { uploadId, role: 'trap', matchStatus: 'matched', trapId: { [Op.ne]: null } },
    attributes: ['id', 'trapId', 'startedAt', 'suggestedVerdict'], order: [['startedAt', 'ASC']],
  });
  if (!tests.length) return [];
  const orders = await WorkOrder.findAll({ where: { siteId: upload.siteId, status: 'done', trapId: { [Op.in]: [...new Set(tests.map((t) => t.trapId!))] } } });
  const changed: number[] = [];
  for (const order of orders) {
    const after = tests.filter((t) => t.trapId === order.trapId && order.doneAt && t.startedAt > order.doneAt && upload.createdAt > order.doneAt);
    const test = after[after.length - 1];
    if (!test) continue;
    const verdict = test.suggestedVerdict;
    const passes = verdict === 'working';
    const fails = isVerdictCode(verdict) && FAILED_VERDICTS.has(verdict as VerdictCode);
    if (!passes && !fails) continue;
    await writeTransaction(async (transaction) => {
      const fresh = (await WorkOrder.findByPk(order.id, { transaction }))!;
      if (fresh.status !== 'done') return;
      const before = snapshot(fresh);
      await fresh.update(passes
        ? { status: 'verified', verifiedByTestId: test.id, verifiedAt: new Date() }
        : { status: 'reopened', verifiedByTestId: null, verifiedAt: null, remindedAt: null }, { transaction });
      await recordAudit(null, {
        siteId: fresh.siteId, action: passes ? 'workorder.verify' : 'workorder.reopen', entityType: 'work_order', entityId: fresh.id,
        before, after: { ...snapshot(fresh), testId: test.id, uploadId, suggestedVerdict: verdict },
        reason: passes ? `Re-test #${test.id} suggests working.` : `Re-test #${test.id} suggests ${VERDICT_LABELS[verdict as VerdictCode]}.`,
      }, transaction);
    });
    changed.push(order.id);
  }
  return changed;
}

/**
 * One reminder per overdue order per day (the site's calendar day): open, scheduled or re-opened
 * orders with an assignee whose due date has passed. The claim (remindedAt) is written in an
 * IMMEDIATE transaction (SQLite) or under a row lock (PostgreSQL) before the mail goes, so two
 * runs at once, in one instance or two, cannot both send.
 */
export async function sendOverdueReminders(now = new Date(), siteIds: number[] | 'all' = 'all') {
  const sites = await Site.findAll(siteIds === 'all' ? {} : { where: { id: { [Op.in]: siteIds } } });
  const sent: number[] = [];
  for (const site of sites) {
    const today = localDate(now, site.timeZone);
    const due = await WorkOrder.findAll({
      where: { siteId: site.id, status: { [Op.in]: ASSIGNABLE }, assigneeId: { [Op.ne]: null }, dueOn: { [Op.lt]: today } },
      attributes: ['id'],
    });
    for (const { id } of due) {
      const claimed = await writeTransaction(async (transaction) => {
        // FOR UPDATE on PostgreSQL, where another instance may be sending the same reminders: the
        // second waits here and then reads the first one's remindedAt. (SQLite: one writer anyway.)
        const order = (await WorkOrder.findByPk(id, { transaction, lock: true }))!;
        if (!ASSIGNABLE.includes(order.status) || !order.assigneeId || !order.dueOn || order.dueOn >= today) return false;
        if (order.remindedAt && localDate(order.remindedAt, site.timeZone) >= today) return false;
        await order.update({ remindedAt: now }, { transaction, silent: true });
        await recordAudit(null, { siteId: site.id, action: 'workorder.remind', entityType: 'work_order', entityId: id, after: { assigneeId: order.assigneeId, dueOn: order.dueOn } }, transaction);
        return true;
      });
      if (!claimed) continue;
      const order = await load(id);
      if (!order.assignee) continue;
      await sendMail(reminderMail({ ...mailInput(order, site), daysOverdue: daysBetween(order.dueOn!, today) }));
      sent.push(id);
    }
  }
  return { sent: sent.length, workOrderIds: sent };
}

const reminderState = globalThis as unknown as { plumewardReminders?: NodeJS.Timeout };

/** The server's reminder interval (PLUMEWARD_REMINDER_MINUTES, default 60; 0 turns it off). */
export function startReminderInterval() {
  const minutes = Number(process.env.PLUMEWARD_REMINDER_MINUTES ?? 60);
  if (reminderState.plumewardReminders || !(minutes > 0)) return;
  const run = () => sendOverdueReminders().catch((err) => console.error('Overdue reminders failed', err));
  reminderState.plumewardReminders = setInterval(run, minutes * 60_000);
  reminderState.plumewardReminders.unref();
  setTimeout(run, 5_000).unref();
}

import 'server-only';
import type { Transaction } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { AuditEvent, User } from '@/models';

export type AuditInput = {
  siteId: number | null;
  action: string;
  entityType: string;
  entityId: number | null;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  reason?: string | null;
};

/** Appends one event to the audit trail, inside the caller's transaction so both land or neither. */
export async function recordAudit(actor: Actor | null, event: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      userId: actor?.userId ?? null,
      siteId: event.siteId,
      action: event.action,
      entityType: event.entityType,
      entityId: event.entityId,
      before: event.before ?? null,
      after: event.after ?? null,
      reason: event.reason ?? null,
    },
    { transaction },
  );
}

/** The fields that differ between two plain objects, as { before, after } halves for the trail. */
export function changedFields(before: Record<string, unknown>, after: Record<string, unknown>) {
  const b: Record<string, unknown> = {};
  const a: Record<string, unknown> = {};
  for (const key of Object.keys(after)) {
    if (after[key] !== undefined && JSON.stringify(before[key]) !== JSON.stringify(after[key])) {
      b[key] = before[key];
      a[key] = after[key];
    }
  }
  return { before: b, after: a, changed: Object.keys(a).length > 0 };
}

/** The trail of one record, newest first, with who did it. */
export async function auditTrail(entityType: string, entityId: number, limit = 50) {
  const events = await AuditEvent.findAll({
    where: { entityType, entityId },
    include: [{ model: User, as: 'user', attributes: ['name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return events.map((e) => ({
    id: e.id, action: e.action, at: e.createdAt.toISOString(),
    by: (e as AuditEvent & { user?: { name: string } }).user?.name ?? 'system',
    before: e.before ?? null, after: e.after ?? null, reason: e.reason ?? null,
  }));
}

import 'server-only';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { parseRegisterCsv, type RegisterProblem } from '@/lib/import/register-csv';
import { AppError } from '@/lib/http/errors';
import { Area, Trap } from '@/models';
import { recordAudit } from './audit';
import { trapDto } from './dto';

export type RegisterPlanRow = {
  line: number;
  tag: string;
  action: 'create' | 'update' | 'unchanged';
  /** For updates: field → [stored value, value in the file]. */
  changes: Record<string, [unknown, unknown]>;
  area: string | null;
};


/**
 * What importing this file would do to the site's register, without writing anything:
 * which tags are created, which change (and how), which new areas appear, and every problem by line.
 * Upserts by tag and never deletes (BRIEF §3).
 */
export async function planRegisterImport(siteId: number, csv: string) {
  const parsed = parseRegisterCsv(csv);
  const existingTraps = await Trap.findAll({
    where: { siteId, tag: { [Op.in]: parsed.rows.map((r) => r.trap.tag) } },
    include: [{ model: Area, as: 'area' }],
  });
  const byTag = new Map(existingTraps.map((t) => [t.tag.toUpperCase(), t]));
  const areas = await Area.findAll({ where: { siteId } });
  const areaByName = new Map(areas.map((a) => [a.name.toLowerCase(), a]));
  const newAreas = [...new Set(parsed.rows.map((r) => r.area).filter((a): a is string => !!a && !areaByName.has(a.toLowerCase())))];

  const compared = parsed.fields.filter((f) => f !== 'tag' && f !== 'areaId');
  const rows: RegisterPlanRow[] = parsed.rows.map(({ line, area, trap }) => {
    const stored = byTag.get(trap.tag.toUpperCase());
    if (!stored) return { line, tag: trap.tag, action: 'create', changes: {}, area };
    const changes: Record<string, [unknown, unknown]> = {};
    for (const field of compared) {
      if ((stored[field] ?? null) !== (trap[field] ?? null)) changes[field] = [stored[field] ?? null, trap[field] ?? null];
    }
    if (parsed.hasArea && (stored.area?.name ?? '').toLowerCase() !== (area ?? '').toLowerCase()) {
      changes.area = [stored.area?.name ?? null, area];
    }
    return { line, tag: stored.tag, action: Object.keys(changes).length ? 'update' : 'unchanged', changes, area };
  });
  const errors = parsed.problems.filter((p) => p.severity === 'error');
  return {
    rows,
    newAreas,
    problems: parsed.problems,
    counts: {
      create: rows.filter((r) => r.action === 'create').length,
      update: rows.filter((r) => r.action === 'update').length,
      unchanged: rows.filter((r) => r.action === 'unchanged').length,
      rejected: new Set(errors.filter((p) => p.line > 1).map((p) => p.line)).size,
    },
    /** Header problems (a missing column) block the import; row problems block it unless the user accepts skipping them. */
    blocked: errors.some((p) => p.line === 1),
    _parsed: parsed,
  };
}

export type RegisterPlan = Omit<Awaited<ReturnType<typeof planRegisterImport>>, '_parsed'>;

export function publicPlan(plan: Awaited<ReturnType<typeof planRegisterImport>>): RegisterPlan {
  const { _parsed, ...rest } = plan;
  void _parsed;
  return rest;
}

/** Applies the file in one transaction: all of its valid rows land, or nothing does. */
export async function applyRegisterImport(actor: Actor, siteId: number, csv: string, skipRejectedRows: boolean) {
  const plan = await planRegisterImport(siteId, csv);
  const rowProblems: RegisterProblem[] = plan.problems.filter((p) => p.severity === 'error' && p.line > 1);
  if (plan.blocked) throw new AppError('invalid', 'The file cannot be imported: fix the header first.', plan.problems);
  if (rowProblems.length && !skipRejectedRows) {
    throw new AppError('invalid', `${plan.counts.rejected} row(s) have problems. Fix them, or import the other rows and skip these.`, rowProblems);
  }
  await writeTransaction(async (transaction) => {
    const areaIdByName = new Map(
      (await Area.findAll({ where: { siteId }, transaction })).map((a) => [a.name.toLowerCase(), a.id]),
    );
    for (const name of plan.newAreas) {
      const area = await Area.create({ siteId, name }, { transaction });
      areaIdByName.set(name.toLowerCase(), area.id);
      await recordAudit(actor, { siteId, action: 'area.create', entityType: 'area', entityId: area.id, after: { name }, reason: 'register import' }, transaction);
    }
    const planByLine = new Map(plan.rows.map((r) => [r.line, r]));
    for (const row of plan._parsed.rows) {
      const step = planByLine.get(row.line)!;
      if (step.action === 'unchanged') continue;
      const areaId = row.area ? areaIdByName.get(row.area.toLowerCase())! : null;
      if (step.action === 'create') {
        const trap = await Trap.create({ ...row.trap, areaId, siteId }, { transaction });
        await recordAudit(actor, { siteId, action: 'trap.create', entityType: 'trap', entityId: trap.id, after: trapDto(trap), reason: 'register import' }, transaction);
      } else {
        const trap = await Trap.findOne({ where: { siteId, tag: step.tag }, transaction });
        if (!trap) throw new AppError('conflict', `Trap ${step.tag} was removed while importing; try again.`);
        const before = Object.fromEntries(Object.entries(step.changes).map(([k, [b]]) => [k, b]));
        const after = Object.fromEntries(Object.entries(step.changes).map(([k, [, a]]) => [k, a]));
        // Only the columns the file has: an absent column leaves the stored value alone.
        const update: Record<string, unknown> = Object.fromEntries(
          plan._parsed.fields.filter((f) => f !== 'tag' && f !== 'areaId').map((f) => [f, row.trap[f]]),
        );
        if (plan._parsed.hasArea) update.areaId = areaId;
        await trap.update(update, { transaction });
        await recordAudit(actor, { siteId, action: 'trap.update', entityType: 'trap', entityId: trap.id, before, after, reason: 'register import' }, transaction);
      }
    }
  });
  return publicPlan(plan);
}

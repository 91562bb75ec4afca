import 'server-only';
import { Op, UniqueConstraintError, type Order, type WhereOptions } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { containsFilter, writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import type { TrapInput, TrapListQuery } from '@/lib/validation/trap';
import { Area, Trap } from '@/models';
import { changedFields, recordAudit } from './audit';
import { trapDto } from './dto';

/** One page of a site's register, sorted and filtered in SQL (sites run to 20,000 traps). */
export async function listTraps(siteId: number, query: TrapListQuery) {
  const where: WhereOptions<Trap> = { siteId };
  if (query.areaId) Object.assign(where, { areaId: query.areaId });
  if (query.trapType) Object.assign(where, { trapType: query.trapType });
  if (query.status) Object.assign(where, { status: query.status });
  if (query.q) {
    const contains = containsFilter(query.q);
    Object.assign(where, { [Op.or]: [{ tag: contains }, { location: contains }] });
  }
  // Empty values (no area, no size) sort first ascending and last descending, as SQLite does by
  // itself; PostgreSQL does the opposite unless told.
  const dir = query.dir === 'desc' ? 'DESC NULLS LAST' : 'ASC NULLS FIRST';
  const order: Order =
    query.sort === 'area'
      ? [[{ model: Area, as: 'area' }, 'name', dir], ['tag', 'ASC']]
      : [[query.sort, dir], ['tag', 'ASC']];
  // Counted without the area join: a trap has at most one area, and the count reads one index.
  const [rows, count] = await Promise.all([
    Trap.findAll({ where, include: [{ model: Area, as: 'area', attributes: ['id', 'name'] }], order, limit: query.pageSize, offset: (query.page - 1) * query.pageSize }),
    Trap.count({ where }),
  ]);
  return { items: rows.map(trapDto), total: count, page: query.page, pageSize: query.pageSize };
}
export type TrapPage = Awaited<ReturnType<typeof listTraps>>;

export async function getTrap(trapId: number) {
  const trap = await Trap.findByPk(trapId, { include: [{ model: Area, as: 'area' }] });
  if (!trap) throw notFound('trap');
  return trapDto(trap);
}

export async function siteIdOfTrap(trapId: number): Promise<number | null> {
  return (await Trap.findByPk(trapId, { attributes: ['siteId'] }))?.siteId ?? null;
}

async function assertAreaOfSite(areaId: number | null | undefined, siteId: number) {
  if (areaId == null) return;
  const area = await Area.findByPk(areaId, { attributes: ['siteId'] });
  if (!area || area.siteId !== siteId) {
    throw new AppError('invalid', 'Invalid request body.', [{ path: 'areaId', message: 'No such area on this site.' }]);
  }
}

function tagClash(err: unknown): never {
  if (err instanceof UniqueConstraintError) {
    throw new AppError('conflict', 'This site already has a trap with that tag.', [{ path: 'tag', message: 'Already in use.' }]);
  }
  throw err;
}

export async function createTrap(actor: Actor, siteId: number, input: TrapInput) {
  await assertAreaOfSite(input.areaId, siteId);
  const id = await writeTransaction(async (transaction) => {
    const trap = await Trap.create({ ...input, siteId }, { transaction }).catch(tagClash);
    await recordAudit(actor, { siteId, action: 'trap.create', entityType: 'trap', entityId: trap.id, after: trapDto(trap) }, transaction);
    return trap.id;
  });
  return getTrap(id);
}

export async function updateTrap(actor: Actor, trapId: number, input: Partial<TrapInput>) {
  const existing = await Trap.findByPk(trapId);
  if (!existing) throw notFound('trap');
  await assertAreaOfSite(input.areaId, existing.siteId);
  await writeTransaction(async (transaction) => {
    const trap = await Trap.findByPk(trapId, { transaction });
    if (!trap) throw notFound('trap');
    const diff = changedFields(trapDto(trap), input);
    if (!diff.changed) return;
    await trap.update(input, { transaction }).catch(tagClash);
    await recordAudit(actor, { siteId: trap.siteId, action: 'trap.update', entityType: 'trap', entityId: trapId, ...diff }, transaction);
  });
  return getTrap(trapId);
}

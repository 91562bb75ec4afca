import 'server-only';
import { col, fn, UniqueConstraintError } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import type { AreaInput } from '@/lib/validation/area';
import { Area, Trap } from '@/models';
import { changedFields, recordAudit } from './audit';
import { areaDto } from './dto';

export async function listAreas(siteId: number) {
  const areas = await Area.findAll({ where: { siteId }, order: [['name', 'ASC']] });
  const counts = (await Trap.findAll({
    where: { siteId },
    attributes: ['areaId', [fn('COUNT', col('id')), 'n']],
    group: ['areaId'],
    raw: true,
  })) as unknown as { areaId: number | null; n: number }[];
  return areas.map((a) => ({ ...areaDto(a), trapCount: Number(counts.find((c) => c.areaId === a.id)?.n ?? 0) }));
}

export async function siteIdOfArea(areaId: number): Promise<number | null> {
  return (await Area.findByPk(areaId, { attributes: ['siteId'] }))?.siteId ?? null;
}

function nameClash(err: unknown): never {
  if (err instanceof UniqueConstraintError) {
    throw new AppError('conflict', 'This site already has an area of that name.', [{ path: 'name', message: 'Already in use.' }]);
  }
  throw err;
}

export async function createArea(actor: Actor, siteId: number, input: AreaInput) {
  return writeTransaction(async (transaction) => {
    const area = await Area.create({ ...input, siteId }, { transaction }).catch(nameClash);
    await recordAudit(actor, { siteId, action: 'area.create', entityType: 'area', entityId: area.id, after: areaDto(area) }, transaction);
    return areaDto(area);
  });
}

export async function updateArea(actor: Actor, areaId: number, input: Partial<AreaInput>) {
  return writeTransaction(async (transaction) => {
    const area = await Area.findByPk(areaId, { transaction });
    if (!area) throw notFound('area');
    const diff = changedFields(areaDto(area), input);
    if (!diff.changed) return areaDto(area);
    await area.update(input, { transaction }).catch(nameClash);
    await recordAudit(actor, { siteId: area.siteId, action: 'area.update', entityType: 'area', entityId: areaId, ...diff }, transaction);
    return areaDto(area);
  });
}

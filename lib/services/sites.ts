import 'server-only';
import { fn, col, Op, UniqueConstraintError } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import type { SiteInput } from '@/lib/validation/site';
import { Area, Site, Survey, Trap } from '@/models';
import { changedFields, recordAudit } from './audit';
import { siteDto, surveyDto } from './dto';

const visibleWhere = (actor: Actor) => (actor.siteIds === 'all' ? {} : { id: { [Op.in]: actor.siteIds } });

/** The sites an actor belongs to, with register counts and their surveys, for the overview. */
export async function listSitesFor(actor: Actor) {
  const sites = await Site.findAll({ where: visibleWhere(actor), order: [['name', 'ASC']] });
  const ids = sites.map((s) => s.id);
  const trapCounts = (await Trap.findAll({
    where: { siteId: { [Op.in]: ids } },
    attributes: ['siteId', 'status', [fn('COUNT', col('id')), 'n']],
    group: ['siteId', 'status'],
    raw: true,
  })) as unknown as { siteId: number; status: string; n: number }[];
  const areaCounts = (await Area.findAll({
    where: { siteId: { [Op.in]: ids } },
    attributes: ['siteId', [fn('COUNT', col('id')), 'n']],
    group: ['siteId'],
    raw: true,
  })) as unknown as { siteId: number; n: number }[];
  const surveys = await Survey.findAll({ where: { siteId: { [Op.in]: ids } }, order: [['startsOn', 'DESC']] });
  return sites.map((site) => {
    const counts = trapCounts.filter((c) => c.siteId === site.id);
    return {
      ...siteDto(site),
      trapCount: counts.filter((c) => c.status !== 'removed').reduce((sum, c) => sum + Number(c.n), 0),
      inServiceCount: Number(counts.find((c) => c.status === 'in_service')?.n ?? 0),
      areaCount: Number(areaCounts.find((c) => c.siteId === site.id)?.n ?? 0),
      surveys: surveys.filter((s) => s.siteId === site.id).map(surveyDto),
    };
  });
}
export type SiteSummary = Awaited<ReturnType<typeof listSitesFor>>[number];

export async function getSite(siteId: number) {
  const site = await Site.findByPk(siteId);
  if (!site) throw notFound('site');
  return siteDto(site);
}

function uniqueClash(err: unknown): never {
  if (err instanceof UniqueConstraintError) {
    throw new AppError('conflict', 'A site with this name or code already exists.', err.errors.map((e) => e.path));
  }
  throw err;
}

export async function createSite(actor: Actor, input: SiteInput) {
  return writeTransaction(async (transaction) => {
    const site = await Site.create(input, { transaction }).catch(uniqueClash);
    await recordAudit(actor, { siteId: site.id, action: 'site.create', entityType: 'site', entityId: site.id, after: siteDto(site) }, transaction);
    return siteDto(site);
  });
}

export async function updateSite(actor: Actor, siteId: number, input: Partial<SiteInput>) {
  return writeTransaction(async (transaction) => {
    const site = await Site.findByPk(siteId, { transaction });
    if (!site) throw notFound('site');
    const diff = changedFields(siteDto(site), input);
    if (!diff.changed) return siteDto(site);
    await site.update(input, { transaction }).catch(uniqueClash);
    await recordAudit(actor, { siteId, action: 'site.update', entityType: 'site', entityId: siteId, ...diff }, transaction);
    return siteDto(site);
  });
}

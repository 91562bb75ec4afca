import 'server-only';
import { col, fn } from 'sequelize';
import type { TrapStatus, TrapType } from '@/lib/domain/vocabulary';
import { Area, Trap } from '@/models';

/** The register of one site counted by area and status, and by trap type. */
export async function registerBreakdown(siteId: number) {
  const rows = (await Trap.findAll({
    where: { siteId },
    attributes: ['areaId', 'trapType', 'status', [fn('COUNT', col('id')), 'n']],
    group: ['areaId', 'trapType', 'status'],
    raw: true,
  })) as unknown as { areaId: number | null; trapType: TrapType; status: TrapStatus; n: number }[];
  const areas = await Area.findAll({ where: { siteId }, order: [['name', 'ASC']] });
  const byArea = [...areas.map((a) => ({ id: a.id as number | null, name: a.name })), { id: null, name: 'No area' }]
    .map((area) => {
      const mine = rows.filter((r) => r.areaId === area.id);
      const count = (status: TrapStatus) => mine.filter((r) => r.status === status).reduce((s, r) => s + Number(r.n), 0);
      return { ...area, inService: count('in_service'), outOfService: count('out_of_service'), removed: count('removed') };
    })
    .filter((a) => a.id !== null || a.inService + a.outOfService + a.removed > 0);
  const byType = new Map<TrapType, number>();
  for (const r of rows) if (r.status !== 'removed') byType.set(r.trapType, (byType.get(r.trapType) ?? 0) + Number(r.n));
  return { byArea, byType: [...byType.entries()].sort((a, b) => b[1] - a[1]).map(([trapType, count]) => ({ trapType, count })) };
}

import { faker } from '@faker-js/faker';
import { Op } from 'sequelize';
import type { TrapStatus } from '@/lib/domain/vocabulary';
import { Area, Site, Trap } from '@/models';
import { DEMO_AREAS, DEMO_SITES, type DemoArea } from './demo-scenario';

function weighted<T extends string>(mix: DemoArea['types'] | DemoArea['applications']): T {
  return faker.helpers.weightedArrayElement(mix.map(([value, weight]) => ({ value, weight }))) as T;
}

// Default orifices by DN are our own (BRIEF §4a); some traps in the register carry a known one.
const KNOWN_ORIFICE_MM: Record<number, number[]> = { 15: [3.2, 4], 20: [4.8, 5.5], 25: [6.4, 7], 40: [8, 9.5], 50: [9.5, 11] };

export async function up() {
  faker.seed(20260401); // fixed, so every fresh demo has the same register
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  const siteIdByCode = new Map(sites.map((s) => [s.code, s.id]));
  for (const demo of DEMO_AREAS) {
    const siteId = siteIdByCode.get(demo.site)!;
    const area = await Area.create({ siteId, name: demo.name, description: null });
    const traps = Array.from({ length: demo.count }, (_, i) => {
      const sizeDn = faker.helpers.arrayElement(demo.sizes);
      const status: TrapStatus = faker.helpers.weightedArrayElement([
        { value: 'in_service' as const, weight: 95 }, { value: 'out_of_service' as const, weight: 4 }, { value: 'removed' as const, weight: 1 },
      ]);
      return {
        siteId,
        areaId: area.id,
        tag: `${demo.tagCode}-${String(demo.firstNumber + i).padStart(3, '0')}`,
        location: `${faker.helpers.arrayElement(demo.places)}, bay ${faker.number.int({ min: 1, max: 12 })}, ${faker.number.float({ min: 0.3, max: 6, fractionDigits: 1 })} m up`,
        trapType: weighted<DemoArea['types'][number][0]>(demo.types),
        application: weighted<DemoArea['applications'][number][0]>(demo.applications),
        sizeDn,
        orificeMm: faker.datatype.boolean(0.3) ? faker.helpers.arrayElement(KNOWN_ORIFICE_MM[sizeDn] ?? [9.5]) : null,
        pressureBarg: faker.helpers.arrayElement(demo.pressures),
        dischargesTo: faker.datatype.boolean(demo.atmosphereShare) ? ('atmosphere' as const) : ('return' as const),
        criticality: demo.criticality,
        status,
      };
    });
    await Trap.bulkCreate(traps);
  }
}

export async function down() {
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  const siteIds = sites.map((s) => s.id);
  await Trap.destroy({ where: { siteId: { [Op.in]: siteIds } } });
  await Area.destroy({ where: { siteId: { [Op.in]: siteIds } } });
}

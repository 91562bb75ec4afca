import { Op } from 'sequelize';
import { Site, Survey } from '@/models';
import { DEMO_SITES } from './demo-scenario';

const isoDate = (d: Date) => d.toISOString().slice(0, 10);
const addDays = (d: Date, days: number) => new Date(d.getTime() + days * 86_400_000);

/** Spring surveys of the last two springs that have passed, plus one in progress now (BRIEF §2). */
export function demoSurveyDates(now: Date) {
  const year = now.getUTCFullYear();
  const lastSpring = now.getUTCMonth() >= 5 ? year : year - 1; // a spring survey ends by May
  const spring = (y: number, offset: number) => {
    const start = new Date(Date.UTC(y, 3, 13 + offset));
    return { startsOn: isoDate(start), endsOn: isoDate(addDays(start, 3)) };
  };
  return [
    { name: `Spring ${lastSpring - 1}`, status: 'published' as const, ...spring(lastSpring - 1, 0), publishedAt: new Date(Date.UTC(lastSpring - 1, 4, 2)) },
    { name: `Spring ${lastSpring}`, status: 'published' as const, ...spring(lastSpring, 1), publishedAt: new Date(Date.UTC(lastSpring, 4, 4)) },
    {
      name: `Survey ${now.toLocaleString('en-GB', { month: 'long', timeZone: 'UTC' })} ${year}`, status: 'in_progress' as const,
      startsOn: isoDate(addDays(now, -1)), endsOn: isoDate(addDays(now, 3)), publishedAt: null,
    },
  ];
}

export async function up() {
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  const dates = demoSurveyDates(new Date());
  await Survey.bulkCreate(sites.flatMap((site) => dates.map((d) => ({ ...d, siteId: site.id }))));
}

export async function down() {
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  await Survey.destroy({ where: { siteId: { [Op.in]: sites.map((s) => s.id) } } });
}

// The demo's outcomes: each site's cost settings, and its two past surveys reviewed and
// published the way an analyst would (every verdict confirmed, a few overridden with a reason),
// so the overview's year-over-year trends exist on first start.
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { epaEmissionFactor } from '@/lib/analysis/defaults';
import { publishSurvey } from '@/lib/services/outcomes';
import { decideVerdict, reviewQueue } from '@/lib/services/review';
import { Site, SiteCostSettings, Survey, TrapVerdict, User } from '@/models';
import { DEMO_SITES, DEMO_USERS } from './demo-scenario';

// Invented prices for the invented sites; the CO2 factors are EPA's (40 CFR 98 Table C-1).
const COSTS = {
  FV: { operatingHoursPerYear: 8000, steamPricePerTonne: 38, fuelPricePerGj: null, fuel: 'natural_gas' as const },
  SM: { operatingHoursPerYear: 6000, steamPricePerTonne: null, fuelPricePerGj: 19.5, fuel: 'distillate_fuel_oil_no2' as const },
};

async function demoActor(): Promise<Actor> {
  const demo = DEMO_USERS.find((u) => u.role === 'analyst')!;
  const user = (await User.findOne({ where: { email: demo.email } }))!;
  return { userId: user.id, name: user.name, email: user.email, role: 'analyst', via: 'session', readOnly: false, siteIds: 'all' };
}

export async function up() {
  const actor = await demoActor();
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  for (const site of sites) {
    const c = COSTS[site.code as keyof typeof COSTS];
    const factor = epaEmissionFactor(c.fuel);
    await SiteCostSettings.create({
      siteId: site.id, operatingHoursPerYear: c.operatingHoursPerYear, steamPricePerTonne: c.steamPricePerTonne, fuelPricePerGj: c.fuelPricePerGj,
      boilerEfficiency: 0.857, feedwaterC: 105, fuel: c.fuel, co2KgPerGj: factor.kgCo2PerGj, co2FactorSource: factor.source,
      co2FactorYear: factor.year, updatedBy: null,
    });
    const published = await Survey.findAll({ where: { siteId: site.id, status: 'published' }, order: [['startsOn', 'ASC']] });
    for (const survey of published) {
      // Reopened for the review, then published again with its figures frozen.
      await survey.update({ status: 'in_progress', publishedAt: null });
      const queue = await reviewQueue(survey.id, { page: 1, pageSize: 10_000 });
      for (const item of queue.items) {
        if (item.suggested === 'background_noise') {
          await decideVerdict(actor, survey.id, {
            trapId: item.trapId, action: 'override', testId: item.latestTestId, verdict: 'working',
            reason: 'Re-checked with the condensate pump stopped: the trap is quiet; the noise came along the line.',
          });
        } else if (item.suggested === 'inconclusive') {
          await decideVerdict(actor, survey.id, { trapId: item.trapId, action: 'override', testId: item.latestTestId, verdict: 'working', reason: 'Listened again on site: cycles normally.' });
        } else {
          await decideVerdict(actor, survey.id, { trapId: item.trapId, action: 'confirm', testId: item.latestTestId });
        }
      }
      await publishSurvey(actor, survey.id, false);
      // Published a fortnight after the survey ended, as a plant's report would be.
      await survey.update({ publishedAt: new Date(Date.parse(survey.endsOn) + 14 * 86_400_000) });
    }
  }
}

export async function down() {
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
  const siteIds = sites.map((s) => s.id);
  await TrapVerdict.destroy({ where: { siteId: { [Op.in]: siteIds } } });
  await SiteCostSettings.destroy({ where: { siteId: { [Op.in]: siteIds } } });
  await Survey.update({ publishedSummary: null, publishedSettings: null, publishedBy: null }, { where: { siteId: { [Op.in]: siteIds } } });
}

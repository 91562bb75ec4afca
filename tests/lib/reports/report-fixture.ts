// A survey report's data made by hand: a small invented site whose figures come from the real
// pure computation (computeSurveyFigures with the analysis defaults and a steam price), so the
// builders are tested on the shapes the service hands them. Two area names and a tag start with
// characters a spreadsheet reads as a formula.
import { resolveParams } from '@/lib/analysis/defaults';
import { costOverrides, type CostSettings } from '@/lib/outcomes/cost-params';
import { computeSurveyFigures, type TrapOutcomeInput } from '@/lib/outcomes/survey-figures';
import type { ReportData } from '@/lib/reports/report-data';
import type { UnitSystem } from '@/lib/domain/vocabulary';

export const SETTINGS: CostSettings = {
  operatingHoursPerYear: 8000, steamPricePerTonne: 32.5, fuelPricePerGj: null, boilerEfficiency: 0.857, feedwaterC: 105,
  fuel: 'natural_gas', co2KgPerGj: 50.29, co2FactorSource: 'EPA 40 CFR Part 98 Subpart C, Table C-1 (81 FR 89188)', co2FactorYear: 2016, currency: 'EUR',
};

const trap = (n: number, areaName: string, verdict: TrapOutcomeInput['verdict'], extra: Partial<TrapOutcomeInput> = {}): TrapOutcomeInput => ({
  trapId: n, tag: `FV-EVP-${String(n).padStart(3, '0')}`, areaId: areaName.length, areaName, status: 'in_service', criticality: 'normal',
  application: 'process', pressureBarg: 8, sizeDn: 15, orificeMm: null, verdict, decided: true, retestPending: false,
  suggestedLossMode: null, suggestedVerdict: verdict, ...extra,
});

export const TRAPS: TrapOutcomeInput[] = [
  trap(1, 'Evaporator Hall', 'blowing', { pressureBarg: 10, sizeDn: 20 }),
  trap(2, 'Evaporator Hall', 'leaking'),
  trap(3, 'Evaporator Hall', 'working'),
  trap(4, 'Boiler House', 'working'),
  trap(5, 'Boiler House', 'cold', { application: 'drip' }),
  trap(6, 'Boiler House', null),
  trap(7, '=1+2', 'leaking', { tag: '+FV-X-007', decided: false }),
  trap(8, '@Tank farm', 'working'),
  trap(9, 'Boiler House', 'working', { status: 'out_of_service' }),
];

export function reportFixture(opts: { unitSystem?: UnitSystem; published?: boolean; currency?: string } = {}): ReportData {
  const settings = { ...SETTINGS, currency: opts.currency ?? 'EUR' };
  const figures = computeSurveyFigures(TRAPS, resolveParams(costOverrides(settings)));
  const published = opts.published ?? false;
  const t = figures.total;
  return {
    site: { name: 'Fenwick Vale Creamery', code: 'FV', timeZone: 'Europe/London', currency: settings.currency, unitSystem: opts.unitSystem ?? 'si' },
    survey: {
      id: 3, name: 'Spring 2027 survey', startsOn: '2027-04-05', endsOn: '2027-04-09', status: published ? 'published' : 'in_progress',
      // 23:30 UTC is already the next day in London (BST): the date printed is the site's.
      publishedAt: published ? '2027-04-20T23:30:00.000Z' : null,
    },
    frozen: published,
    settings,
    figures,
    trends: {
      surveys: [
        { id: 1, name: 'Spring 2025 survey', startsOn: '2025-04-07', status: 'published', frozen: true, tested: 6, failed: 1, failureRate: 1 / 6, lossKgPerHour: 4.2, lossTonnesPerYear: 33.6, costPerYear: 1092, co2TonnesPerYear: 6.1 },
        { id: 2, name: 'Spring 2026 survey', startsOn: '2026-04-06', status: 'published', frozen: true, tested: 7, failed: 3, failureRate: 3 / 7, lossKgPerHour: 21.5, lossTonnesPerYear: 172, costPerYear: 5590, co2TonnesPerYear: 31.2 },
        { id: 3, name: 'Spring 2027 survey', startsOn: '2027-04-05', status: published ? 'published' : 'in_progress', frozen: published, tested: t.tested, failed: t.failed, failureRate: t.failureRate, lossKgPerHour: t.lossKgPerHour, lossTonnesPerYear: t.lossTonnesPerYear, costPerYear: t.costPerYear, co2TonnesPerYear: t.co2TonnesPerYear },
      ],
      areas: [
        { areaName: 'Boiler House', bySurvey: [{ tested: 3, failed: 0, failureRate: 0, lossKgPerHour: 0, costPerYear: 0 }, { tested: 3, failed: 1, failureRate: 1 / 3, lossKgPerHour: 0, costPerYear: 0 }, null] },
        { areaName: '=1+2', bySurvey: [null, null, { tested: 1, failed: 1, failureRate: 1, lossKgPerHour: 2, costPerYear: 520 }] },
      ],
    },
    generatedAt: '2027-04-22T08:00:00.000Z',
  };
}

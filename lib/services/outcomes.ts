import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { DEFAULT_PARAMS, resolveParams, type SeverityMode } from '@/lib/analysis/defaults';
import { isVerdictCode, type VerdictCode } from '@/lib/analysis/verdict-codes';
import { sequelize, writeTransaction } from '@/lib/db';
import type { TrapStatus } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import { costOverrides, type CostSettings } from '@/lib/outcomes/cost-params';
import { computeSurveyFigures, type SurveyFigures, type TrapOutcomeInput } from '@/lib/outcomes/survey-figures';
import type { CostSettingsInput } from '@/lib/validation/cost-settings';
import { Site, SiteCostSettings, Survey, WorkOrder } from '@/models';
import { recordAudit } from './audit';
import { DerivedCache, surveyDataVersion } from './derived-cache';
import { latestTrapTests, reviewState, surveyDecisions } from './review';

/** The site's cost settings, or the analysis defaults (no price: cost unknown until an admin sets one). */
export async function getCostSettings(siteId: number): Promise<CostSettings & { isDefault: boolean }> {
  const site = await Site.findByPk(siteId);
  if (!site) throw notFound('site');
  const row = await SiteCostSettings.findOne({ where: { siteId } });
  if (row) {
    return {
      operatingHoursPerYear: row.operatingHoursPerYear, steamPricePerTonne: row.steamPricePerTonne, fuelPricePerGj: row.fuelPricePerGj,
      boilerEfficiency: row.boilerEfficiency, feedwaterC: row.feedwaterC, fuel: row.fuel, co2KgPerGj: row.co2KgPerGj,
      co2FactorSource: row.co2FactorSource, co2FactorYear: row.co2FactorYear, currency: site.currency, isDefault: false,
    };
  }
  const d = DEFAULT_PARAMS;
  return {
    operatingHoursPerYear: d.loss.operatingHoursPerYear, steamPricePerTonne: null, fuelPricePerGj: null,
    boilerEfficiency: d.cost.boilerEfficiency, feedwaterC: d.cost.feedwaterC, fuel: d.cost.emissionFactor.fuel,
    co2KgPerGj: d.cost.emissionFactor.kgCo2PerGj, co2FactorSource: d.cost.emissionFactor.source, co2FactorYear: d.cost.emissionFactor.year,
    currency: site.currency, isDefault: true,
  };
}

export async function updateCostSettings(actor: Actor, siteId: number, input: CostSettingsInput) {
  await writeTransaction(async (transaction) => {
    const existing = await SiteCostSettings.findOne({ where: { siteId }, transaction });
    const before = existing ? existing.get({ plain: true }) : null;
    if (existing) await existing.update({ ...input, updatedBy: actor.userId }, { transaction });
    else await SiteCostSettings.create({ ...input, siteId, updatedBy: actor.userId }, { transaction });
    await recordAudit(actor, { siteId, action: 'settings.cost', entityType: 'site_cost_settings', entityId: siteId, before: before as Record<string, unknown> | null, after: input }, transaction);
  });
  return getCostSettings(siteId);
}

type SiteTrapRow = {
  id: number; tag: string; area_id: number | null; area_name: string | null; status: TrapStatus; criticality: string;
  application: string | null; pressure_barg: number; size_dn: number | null; orifice_mm: number | null;
};

/** Every trap of the site with its verdict in the survey: the analyst's where decided, else the suggestion of its latest trap-point test. */
async function outcomeInputs(survey: Survey): Promise<TrapOutcomeInput[]> {
  const [traps, latest, decisions] = await Promise.all([
    sequelize.query<SiteTrapRow>(
      `SELECT tr.id, tr.tag, tr.area_id, a.name AS area_name, tr.status, tr.criticality, tr.application, tr.pressure_barg, tr.size_dn, tr.orifice_mm
       FROM traps tr LEFT JOIN areas a ON a.id = tr.area_id WHERE tr.site_id = :siteId ORDER BY tr.id`,
      { replacements: { siteId: survey.siteId }, type: QueryTypes.SELECT },
    ),
    latestTrapTests(survey.id),
    surveyDecisions(survey.id),
  ]);
  return traps.map((trap) => {
    const test = latest.get(trap.id);
    const d = decisions.get(trap.id);
    const state = test ? reviewState(d, test) : d?.state === 'retest' ? 'retest_pending' : 'unreviewed';
    const decided = state === 'confirmed' || state === 'overridden';
    const suggested = isVerdictCode(test?.suggestedVerdict) ? (test!.suggestedVerdict as VerdictCode) : null;
    const lossMode = (test?.lossMode ?? null) as SeverityMode | null;
    return {
      trapId: trap.id, tag: trap.tag, areaId: trap.area_id ?? null, areaName: trap.area_name ?? null, status: trap.status,
      criticality: trap.criticality, application: trap.application ?? null, pressureBarg: trap.pressure_barg, sizeDn: trap.size_dn ?? null,
      orificeMm: trap.orifice_mm ?? null, verdict: test ? (decided && isVerdictCode(d!.verdict) ? (d!.verdict as VerdictCode) : suggested) : null,
      decided, retestPending: state === 'retest_pending', suggestedLossMode: lossMode, suggestedVerdict: suggested,
    };
  });
}

export type SurveySummary = {
  survey: { id: number; siteId: number; name: string; startsOn: string; endsOn: string; status: string; publishedAt: string | null };
  /** True for a published survey: the figures and settings as they were published. */
  frozen: boolean;
  settings: CostSettings;
  figures: SurveyFigures;
};

/** A draft's figures over its site's 20,000 traps, kept while its data and the settings stand (lib/services/derived-cache.ts). */
const draftFigures = new DerivedCache<SurveyFigures>(8);

/** A survey's figures: frozen as published, or computed from the current settings (a draft follows them). */
export async function surveySummary(surveyId: number): Promise<SurveySummary> {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  const head = {
    id: survey.id, siteId: survey.siteId, name: survey.name, startsOn: survey.startsOn, endsOn: survey.endsOn, status: survey.status,
    publishedAt: survey.publishedAt?.toISOString() ?? null,
  };
  if (survey.status === 'published' && survey.publishedSummary && survey.publishedSettings) {
    return { survey: head, frozen: true, settings: survey.publishedSettings as unknown as CostSettings, figures: survey.publishedSummary as unknown as SurveyFigures };
  }
  const [version, settings] = await Promise.all([surveyDataVersion(surveyId), getCostSettings(survey.siteId)]);
  const figures = await draftFigures.get(String(surveyId), `${version}:${JSON.stringify(settings)}`,
    async () => computeSurveyFigures(await outcomeInputs(survey), resolveParams(costOverrides(settings))));
  return { survey: head, frozen: false, settings, figures };
}

/**
 * The summary as the API sends it: the costliest `failures` of the list (all when 'all'), and how
 * many there are. At 20,000 traps the whole list is a megabyte; the reports carry it in full.
 */
export function listedFailures(summary: SurveySummary, failures: number | 'all') {
  const all = summary.figures.failures;
  return { ...summary, figures: { ...summary.figures, failures: failures === 'all' ? all : all.slice(0, failures), failureCount: all.length } };
}

/**
 * Publishing freezes the survey's verdicts and figures with the settings that made them. Every
 * tested trap must be decided, unless the analyst explicitly accepts the undecided ones.
 */
export async function publishSurvey(actor: Actor, surveyId: number, acceptUndecided: boolean) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  if (survey.status === 'published') throw new AppError('conflict', `${survey.name} is already published.`);
  const summary = await surveySummary(surveyId);
  const undecided = summary.figures.total.tested - summary.figures.total.decided;
  if (undecided > 0 && !acceptUndecided) {
    throw new AppError('conflict', `${undecided} tested trap(s) have no confirmed verdict. Review them, or publish accepting their suggested verdicts.`, { undecided });
  }
  await writeTransaction(async (transaction) => {
    await survey.update({
      status: 'published', publishedAt: new Date(), publishedBy: actor.userId,
      publishedSummary: summary.figures as unknown as Record<string, unknown>, publishedSettings: summary.settings as unknown as Record<string, unknown>,
    }, { transaction });
    await recordAudit(actor, {
      siteId: survey.siteId, action: 'survey.publish', entityType: 'survey', entityId: surveyId,
      after: { undecidedAccepted: undecided, failed: summary.figures.total.failed, tested: summary.figures.total.tested },
    }, transaction);
  });
  return surveySummary(surveyId);
}

/** Every survey of a site side by side, oldest first: the year-over-year view, in total and by area. */
export async function siteTrends(siteId: number) {
  const surveys = await Survey.findAll({ where: { siteId, status: { [Op.in]: ['in_progress', 'published'] } }, order: [['startsOn', 'ASC']] });
  const summaries = await Promise.all(surveys.map((s) => surveySummary(s.id)));
  const areaNames = [...new Set(summaries.flatMap((s) => s.figures.byArea.map((a) => a.areaName)))].sort();
  // Savings (issue 6): the yearly loss of failed traps whose repair a re-test has verified.
  const orders = await WorkOrder.findAll({ where: { siteId }, attributes: ['status', 'lossKgPerHour', 'costPerYear'] });
  const verified = orders.filter((o) => o.status === 'verified');
  return {
    repairs: {
      open: orders.filter((o) => o.status === 'open' || o.status === 'scheduled' || o.status === 'reopened').length,
      done: orders.filter((o) => o.status === 'done').length,
      verified: verified.length,
      savedKgPerHour: verified.reduce((sum, o) => sum + (o.lossKgPerHour ?? 0), 0),
      savedCostPerYear: verified.some((o) => o.costPerYear === null) ? null : verified.reduce((sum, o) => sum + (o.costPerYear ?? 0), 0),
    },
    surveys: summaries.map((s) => ({
      id: s.survey.id, name: s.survey.name, startsOn: s.survey.startsOn, status: s.survey.status, frozen: s.frozen,
      currency: s.settings.currency, total: s.figures.total,
    })),
    areas: areaNames.map((name) => ({
      areaName: name,
      bySurvey: summaries.map((s) => {
        const a = s.figures.byArea.find((x) => x.areaName === name);
        return a ? { tested: a.tested, failed: a.failed, failureRate: a.failureRate, lossKgPerHour: a.lossKgPerHour, costPerYear: a.costPerYear } : null;
      }),
    })),
  };
}
export type SiteTrends = Awaited<ReturnType<typeof siteTrends>>;

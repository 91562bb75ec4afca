// A survey's figures (BRIEF §4.8, §5): coverage, verdict counts, failure rate, steam lost, cost
// and CO2, in total and by area, and the costliest failures. Pure: the traps and their verdicts
// in, the figures out; loss and cost come from lib/analysis with the site's parameters.
import type { AnalysisParams, SeverityMode } from '@/lib/analysis/defaults';
import { costOfLoss } from '@/lib/analysis/energy-cost';
import { estimateSteamLoss } from '@/lib/analysis/steam-loss';
import { FAILED_VERDICTS, VERDICT_CODES, type VerdictCode } from '@/lib/analysis/verdict-codes';
import type { TrapStatus } from '@/lib/domain/vocabulary';

export type TrapOutcomeInput = {
  trapId: number;
  tag: string;
  areaId: number | null;
  areaName: string | null;
  status: TrapStatus;
  criticality: string;
  application: string | null;
  pressureBarg: number;
  sizeDn: number | null;
  orificeMm: number | null;
  /** Null when the trap has no trap-point test in the survey. */
  verdict: VerdictCode | null;
  /** The verdict is the analyst's (confirmed or overridden), not only suggested. */
  decided: boolean;
  retestPending: boolean;
  /** The loss mode the analysis chose for the suggestion (rapid cycling is a kind of leaking). */
  suggestedLossMode: SeverityMode | null;
  suggestedVerdict: VerdictCode | null;
};

/** Which share of a full orifice's flow a verdict loses (BRIEF §4a severities); none for cold or backing up. */
export function lossModeOf(t: Pick<TrapOutcomeInput, 'verdict' | 'suggestedVerdict' | 'suggestedLossMode'>): SeverityMode | null {
  if (t.verdict === t.suggestedVerdict && t.suggestedLossMode) return t.suggestedLossMode;
  if (t.verdict === 'blowing') return 'blow_through';
  if (t.verdict === 'leaking') return 'leaking';
  return null;
}

type Tally = {
  registered: number; inService: number; tested: number; untested: number; failed: number; decided: number; retestPending: number;
  verdicts: Record<VerdictCode, number>; failureRate: number | null;
  lossKgPerHour: number; lossTonnesPerYear: number; costPerYear: number | null; co2TonnesPerYear: number;
};

const emptyTally = (): Tally => ({
  registered: 0, inService: 0, tested: 0, untested: 0, failed: 0, decided: 0, retestPending: 0,
  verdicts: Object.fromEntries(VERDICT_CODES.map((c) => [c, 0])) as Record<VerdictCode, number>,
  failureRate: null, lossKgPerHour: 0, lossTonnesPerYear: 0, costPerYear: 0, co2TonnesPerYear: 0,
});

export type FailureFigure = {
  trapId: number; tag: string; areaName: string | null; verdict: VerdictCode; decided: boolean; criticality: string; application: string | null;
  kgPerHour: number; tonnesPerYear: number; costPerYear: number | null; co2TonnesPerYear: number; orificeMm: number; orificeSource: string;
};

export function computeSurveyFigures(traps: readonly TrapOutcomeInput[], params: AnalysisParams) {
  const total = emptyTally();
  const areas = new Map<string, { areaId: number | null; areaName: string; tally: Tally }>();
  const failures: FailureFigure[] = [];
  let costKnown = true;
  for (const t of traps) {
    if (t.status === 'removed') continue;
    const key = String(t.areaId ?? 'none');
    if (!areas.has(key)) areas.set(key, { areaId: t.areaId, areaName: t.areaName ?? 'No area', tally: emptyTally() });
    const tallies = [total, areas.get(key)!.tally];
    for (const x of tallies) x.registered++;
    if (t.status !== 'in_service') continue;
    for (const x of tallies) x.inService++;
    if (!t.verdict) {
      for (const x of tallies) x.untested++;
      continue;
    }
    for (const x of tallies) {
      x.tested++;
      x.verdicts[t.verdict]++;
      if (t.decided) x.decided++;
      if (t.retestPending) x.retestPending++;
    }
    if (!FAILED_VERDICTS.has(t.verdict)) continue;
    for (const x of tallies) x.failed++;
    const mode = lossModeOf(t);
    if (!mode) continue;
    const loss = estimateSteamLoss({ pressureBarg: t.pressureBarg, orificeMm: t.orificeMm, sizeDn: t.sizeDn, lossMode: mode }, params);
    const cost = costOfLoss(loss.tonnesPerYear, t.pressureBarg, params);
    if (cost.costPerYear === null) costKnown = false;
    for (const x of tallies) {
      x.lossKgPerHour += loss.kgPerHour;
      x.lossTonnesPerYear += loss.tonnesPerYear;
      x.costPerYear = x.costPerYear === null || cost.costPerYear === null ? null : x.costPerYear + cost.costPerYear;
      x.co2TonnesPerYear += cost.co2TonnesPerYear;
    }
    failures.push({
      trapId: t.trapId, tag: t.tag, areaName: t.areaName, verdict: t.verdict, decided: t.decided, criticality: t.criticality,
      application: t.application, kgPerHour: loss.kgPerHour, tonnesPerYear: loss.tonnesPerYear, costPerYear: cost.costPerYear,
      co2TonnesPerYear: cost.co2TonnesPerYear, orificeMm: loss.orificeMm, orificeSource: loss.orificeSource,
    });
  }
  const finish = (x: Tally) => ({ ...x, failureRate: x.tested ? x.failed / x.tested : null, costPerYear: costKnown ? x.costPerYear : null });
  failures.sort((a, b) => (b.costPerYear ?? b.kgPerHour) - (a.costPerYear ?? a.kgPerHour) || b.kgPerHour - a.kgPerHour);
  return {
    total: finish(total),
    byArea: [...areas.values()].map((a) => ({ areaId: a.areaId, areaName: a.areaName, ...finish(a.tally) })).sort((a, b) => a.areaName.localeCompare(b.areaName)),
    failures,
    basis: {
      convention: params.loss.convention, dischargeCoefficient: params.loss.dischargeCoefficient, severity: params.loss.severity,
      operatingHoursPerYear: params.loss.operatingHoursPerYear, cost: params.cost,
    },
  };
}
export type SurveyFigures = ReturnType<typeof computeSurveyFigures>;

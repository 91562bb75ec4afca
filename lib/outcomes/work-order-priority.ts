// The priority of a repair work order, from what the failure costs a year and how much the trap
// matters. Pure: the failed trap's figures in, a priority and the reason for it out. The bands are
// our own starting point (not from a published source); change them here and in the rule table's
// tests together, and say why.
import { VERDICT_LABELS, type VerdictCode } from '@/lib/analysis/verdict-codes';

export const PRIORITY_ORDER = ['urgent', 'high', 'normal', 'low'] as const;
export type Priority = (typeof PRIORITY_ORDER)[number];

/**
 * Yearly cost bands, in the site's currency, first match wins. Where no price is set the cost is
 * unknown and the steam lost decides instead, with the second set of bands (kg/h).
 */
export const COST_BANDS: readonly { atLeast: number; priority: Priority }[] = [
  { atLeast: 5000, priority: 'urgent' },
  { atLeast: 1000, priority: 'high' },
  { atLeast: 200, priority: 'normal' },
  { atLeast: 0, priority: 'low' },
];
export const LOSS_BANDS_KG_PER_HOUR: readonly { atLeast: number; priority: Priority }[] = [
  { atLeast: 20, priority: 'urgent' },
  { atLeast: 5, priority: 'high' },
  { atLeast: 1, priority: 'normal' },
  { atLeast: 0, priority: 'low' },
];

export type PriorityInput = {
  verdict: VerdictCode;
  /** Register application: 'drip' is a trap draining a steam main. */
  application: string | null;
  criticality: 'low' | 'normal' | 'high' | string;
  /** Yearly cost of the steam lost, in the site's currency; null when no price is set. */
  costPerYear: number | null;
  /** Steam lost; null or 0 for failures that lose no live steam (cold, backing up). */
  kgPerHour: number | null;
  currency: string;
};

export type PriorityResult = { priority: Priority; reason: string };

const step = (p: Priority, by: number): Priority =>
  PRIORITY_ORDER[Math.min(PRIORITY_ORDER.length - 1, Math.max(0, PRIORITY_ORDER.indexOf(p) - by))];
const higher = (a: Priority, b: Priority): Priority => (PRIORITY_ORDER.indexOf(a) <= PRIORITY_ORDER.indexOf(b) ? a : b);
const band = (value: number, bands: readonly { atLeast: number; priority: Priority }[]) => bands.find((b) => value >= b.atLeast)!;
const whole = (n: number) => Math.round(n).toLocaleString('en-GB');

/**
 * The rule table, applied in order:
 * 1. Base: a failure losing steam ranks by its yearly cost (COST_BANDS), or by kg/h when the cost is
 *    unknown (LOSS_BANDS_KG_PER_HOUR). A failure losing no live steam (cold, backing up) starts at
 *    normal: the equipment it drains floods or stays cold, which the loss figures do not show.
 * 2. A cold trap on a drip (draining a steam main) is at least high, whatever its cost: condensate
 *    collecting in a main is carried along by the steam and risks water hammer.
 * 3. Criticality: high raises it one step; low lowers it one step, but never a cold drip below high.
 */
export function workOrderPriority(input: PriorityInput): PriorityResult {
  const reasons: string[] = [];
  let priority: Priority;
  const kg = input.kgPerHour ?? 0;
  if (kg <= 0) {
    priority = 'normal';
    reasons.push(`${VERDICT_LABELS[input.verdict].toLowerCase()}: no live steam lost, but the equipment it drains is affected (normal)`);
  } else if (input.costPerYear !== null) {
    const b = band(input.costPerYear, COST_BANDS);
    priority = b.priority;
    reasons.push(`${whole(input.costPerYear)} ${input.currency}/yr lost (${b.atLeast > 0 ? `≥ ${whole(b.atLeast)}` : `< ${whole(COST_BANDS[COST_BANDS.length - 2].atLeast)}`} → ${b.priority})`);
  } else {
    const b = band(kg, LOSS_BANDS_KG_PER_HOUR);
    priority = b.priority;
    reasons.push(`${kg.toFixed(1)} kg/h of steam lost, no steam price set (${b.atLeast > 0 ? `≥ ${b.atLeast} kg/h` : `< ${LOSS_BANDS_KG_PER_HOUR[LOSS_BANDS_KG_PER_HOUR.length - 2].atLeast} kg/h`} → ${b.priority})`);
  }
  const coldDrip = input.verdict === 'cold' && input.application === 'drip';
  if (coldDrip && higher(priority, 'high') !== priority) {
    priority = 'high';
    reasons.push('a cold trap draining a steam main ranks high whatever its cost: condensate left in the main risks water hammer');
  } else if (coldDrip) {
    reasons.push('a cold trap draining a steam main: condensate left in the main risks water hammer');
  }
  if (input.criticality === 'high' && priority !== 'urgent') {
    priority = step(priority, 1);
    reasons.push(`high criticality raises it to ${priority}`);
  } else if (input.criticality === 'low' && priority !== 'low' && !(coldDrip && priority === 'high')) {
    priority = step(priority, -1);
    reasons.push(`low criticality lowers it to ${priority}`);
  } else if (input.criticality === 'low' && coldDrip) {
    reasons.push('low criticality does not lower it below high');
  }
  const text = reasons.join('; ');
  return { priority, reason: text.charAt(0).toUpperCase() + text.slice(1) + '.' };
}

/** Sort key: urgent first. */
export const priorityRank = (p: string) => {
  const i = PRIORITY_ORDER.indexOf(p as Priority);
  return i < 0 ? PRIORITY_ORDER.length : i;
};

// The work-order priority rule table (lib/outcomes/work-order-priority.ts): our own bands, not a
// published source; each row of the table below is one rule or one edge of a band.
import { describe, expect, it } from 'vitest';
import { priorityRank, workOrderPriority, type PriorityInput } from '@/lib/outcomes/work-order-priority';

const base: PriorityInput = { verdict: 'leaking', application: 'process', criticality: 'normal', costPerYear: 0, kgPerHour: 1, currency: 'EUR' };

describe('workOrderPriority', () => {
  it.each([
    // yearly cost bands, normal criticality
    ['cost 6,000/yr', 'urgent', { costPerYear: 6000 }],
    ['cost exactly 5,000/yr', 'urgent', { costPerYear: 5000 }],
    ['cost 4,999/yr', 'high', { costPerYear: 4999 }],
    ['cost exactly 1,000/yr', 'high', { costPerYear: 1000 }],
    ['cost 999/yr', 'normal', { costPerYear: 999 }],
    ['cost exactly 200/yr', 'normal', { costPerYear: 200 }],
    ['cost 150/yr', 'low', { costPerYear: 150 }],
    // criticality moves one step
    ['cost 1,500/yr, high criticality', 'urgent', { costPerYear: 1500, criticality: 'high' }],
    ['cost 6,000/yr, high criticality (already urgent)', 'urgent', { costPerYear: 6000, criticality: 'high' }],
    ['cost 1,500/yr, low criticality', 'normal', { costPerYear: 1500, criticality: 'low' }],
    ['cost 150/yr, low criticality (already low)', 'low', { costPerYear: 150, criticality: 'low' }],
    // no steam price: kg/h decides
    ['no price, 25 kg/h', 'urgent', { costPerYear: null, kgPerHour: 25 }],
    ['no price, 6 kg/h', 'high', { costPerYear: null, kgPerHour: 6 }],
    ['no price, 2 kg/h', 'normal', { costPerYear: null, kgPerHour: 2 }],
    ['no price, 0.4 kg/h', 'low', { costPerYear: null, kgPerHour: 0.4 }],
    // failures that lose no live steam start at normal
    ['backing up, no loss', 'normal', { verdict: 'backing_up', costPerYear: 0, kgPerHour: 0 }],
    ['cold tracer, no loss', 'normal', { verdict: 'cold', application: 'tracer', costPerYear: 0, kgPerHour: 0 }],
    ['cold tracer, low criticality', 'low', { verdict: 'cold', application: 'tracer', costPerYear: 0, kgPerHour: 0, criticality: 'low' }],
    // a cold drip on a steam main is at least high, whatever its cost and criticality
    ['cold drip, no loss', 'high', { verdict: 'cold', application: 'drip', costPerYear: 0, kgPerHour: 0 }],
    ['cold drip, low criticality', 'high', { verdict: 'cold', application: 'drip', costPerYear: 0, kgPerHour: null, criticality: 'low' }],
    ['cold drip, high criticality', 'urgent', { verdict: 'cold', application: 'drip', costPerYear: 0, kgPerHour: 0, criticality: 'high' }],
    // the drip rule is for cold traps only: a cheap leaking drip ranks by its cost
    ['leaking drip, 150/yr', 'low', { verdict: 'leaking', application: 'drip', costPerYear: 150 }],
  ] as const)('%s → %s', (_name, expected, change) => {
    expect(workOrderPriority({ ...base, ...change } as PriorityInput).priority).toBe(expected);
  });

  it('says why, with the numbers', () => {
    expect(workOrderPriority({ ...base, costPerYear: 1500, criticality: 'high' }).reason)
      .toBe('1,500 EUR/yr lost (≥ 1,000 → high); high criticality raises it to urgent.');
    expect(workOrderPriority({ ...base, costPerYear: null, kgPerHour: 6.25 }).reason)
      .toBe('6.3 kg/h of steam lost, no steam price set (≥ 5 kg/h → high).');
    const drip = workOrderPriority({ ...base, verdict: 'cold', application: 'drip', costPerYear: 0, kgPerHour: 0, criticality: 'low' }).reason;
    expect(drip).toMatch(/^Cold: no live steam lost/);
    expect(drip).toContain('does not lower it below high');
    expect(drip).toContain('water hammer');
  });

  it('orders urgent first', () => {
    expect(['low', 'urgent', 'normal', 'high'].sort((a, b) => priorityRank(a) - priorityRank(b))).toEqual(['urgent', 'high', 'normal', 'low']);
  });
});

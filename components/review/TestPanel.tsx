'use client';

import Link from 'next/link';
import { useState } from 'react';
import { VERDICT_CODES, VERDICT_LABELS } from '@/lib/analysis/verdict-codes';
import { TRAP_TYPE_LABELS, type TrapType } from '@/lib/domain/vocabulary';
import type { TestDetail } from '@/lib/services/review';
import { FieldNotes } from './FieldNotes';
import { TestChart, type ChartFigures } from './TestChart';
import { VerdictBadge } from './VerdictBadge';

type Figures = {
  level: Record<string, number | null>; bands: Record<string, number | null>; temperature: Record<string, number | boolean | null>;
  cycles: Record<string, number | boolean | null> & { openSpansS: [number, number][] };
  reference: Record<string, unknown>; verdict: { suggested: string | null; confidence: string | null; reasons: string[]; row: number | null };
  loss: Record<string, number | string | null>; notes: string[]; params?: unknown;
};

const n = (v: unknown, digits = 1, unit = '') => (typeof v === 'number' && Number.isFinite(v) ? `${v.toFixed(digits)}${unit}` : '—');
const pct = (v: unknown) => (typeof v === 'number' ? `${Math.round(v * 100)} %` : '—');

export type DecideAction = { action: 'confirm' } | { action: 'override'; verdict: string; reason: string } | { action: 'retest'; reason: string };

export function TestPanel({ detail, canDecide, onDecide, busy, error, overrideOpen, setOverrideOpen, siteId, timeZone }: {
  detail: TestDetail; canDecide: boolean; onDecide: (a: DecideAction) => void; busy: boolean; error: string | null;
  overrideOpen: boolean; setOverrideOpen: (open: boolean) => void; siteId: number; timeZone: string;
}) {
  const { test, trap, decision } = detail;
  const f = (test.figures ?? {}) as unknown as Figures;
  const [verdict, setVerdict] = useState<string>(f.verdict?.suggested ?? 'leaking');
  const [reason, setReason] = useState('');
  const frozen = detail.survey?.status === 'published';
  const chartFigures: ChartFigures = {
    quietMaxDb: (f.bands?.quietMaxDb as number) ?? null, liveSteamMinDb: (f.bands?.liveSteamMinDb as number) ?? null,
    openSpansS: f.cycles?.openSpansS ?? [],
  };
  const started = new Date(test.startedAt).toLocaleString('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'medium' });
  const rows: [string, string][] = [
    ['Mean level', n(f.level?.meanDb, 1, ' dB')], ['Median / spread (SD)', `${n(f.level?.medianDb, 1)} / ${n(f.level?.sdDb, 1)} dB`],
    ['10th–90th percentile', `${n(f.level?.p10Db, 1)}–${n(f.level?.p90Db, 1)} dB`],
    ['Duty cycle', pct(f.cycles?.dutyCycle)], ['Cycles per minute', n(f.cycles?.cyclesPerMinute, 1)],
    ['Open / closed intervals', `${f.cycles?.openIntervals ?? '—'} / ${f.cycles?.closedIntervals ?? '—'}`],
    ['Mean open / closed', `${n(f.cycles?.meanOpenS, 1, ' s')} / ${n(f.cycles?.meanClosedS, 1, ' s')}`],
    ['Mean level while closed', n(f.cycles?.meanClosedDb, 1, ' dB')],
    ['Time in quiet / condensate / live steam', `${pct(f.bands?.quietShare)} / ${pct(f.bands?.condensateShare)} / ${pct(f.bands?.liveSteamShare)}`],
    ['Surface temperature (mean)', n(f.temperature?.meanC, 1, ' °C')], ['Saturation temperature', n(f.temperature?.tsatC, 1, ' °C')],
    ['Subcooling', n(f.temperature?.subcoolingK, 1, ' K')],
    ['Pipe beside it', f.reference?.available ? `${n(f.reference.meanDb, 1, ' dB')} (trap ${n(f.reference.differenceDb, 1, ' dB')} louder; needs ${n(f.reference.marginDb, 0, ' dB')})` : 'no reference reading'],
    ['Estimated steam loss', f.loss?.kgPerHour != null ? `${n(f.loss.kgPerHour, 1, ' kg/h')} · ${n(f.loss.tonnesPerYear, 0, ' t/yr')}` : (f.loss?.note as string) ?? '—'],
    ['Cost and CO2 per year', f.loss?.costPerYear != null ? `${n(f.loss.costPerYear, 0)} ${f.loss.currency ?? ''} · ${n(f.loss.co2TonnesPerYear, 1, ' t CO2')}` : 'cost settings come with the site settings'],
  ];
  return (
    <div className="space-y-4" data-testid="test-panel">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 className="tag-text text-xl font-semibold">{trap?.tag ?? test.tag}{test.role === 'reference' && <span className="ml-2 text-sm font-normal text-ink-soft">(pipe beside it)</span>}</h2>
          <p className="text-sm text-ink-soft">
            {trap ? `${TRAP_TYPE_LABELS[trap.trapType as TrapType]} · ${trap.areaName ?? 'no area'} · ${trap.pressureBarg} barg` : 'not in the register'} · {started} · {n(test.durationS, 0, ' s')} at {n(test.sampleRateHz, 1, ' Hz')}
          </p>
        </div>
        {trap && <Link href={`/sites/${siteId}/traps/${trap.id}`} className="text-sm text-accent-700 hover:underline">Trap history →</Link>}
      </div>
      <TestChart testId={test.id} referenceTestId={detail.referenceTestId} figures={chartFigures} />
      <div className="grid gap-4 lg:grid-cols-5">
        <section className="panel p-4 lg:col-span-3" aria-label="Figures">
          <dl className="grid grid-cols-1 gap-x-6 text-sm sm:grid-cols-2">
            {rows.map(([label, value]) => (
              <div key={label} className="flex justify-between gap-3 border-b border-line py-1"><dt className="text-ink-soft">{label}</dt><dd className="text-right">{value}</dd></div>
            ))}
          </dl>
          <details className="mt-3 text-xs text-ink-soft">
            <summary className="cursor-pointer">Parameters used</summary>
            <pre className="mt-2 max-h-64 overflow-auto rounded bg-surface-sunken p-2">{JSON.stringify(f.params ?? null, null, 1)}</pre>
          </details>
        </section>
        <section className="panel space-y-3 p-4 lg:col-span-2" aria-label="Verdict">
          <div>
            <div className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Suggested</div>
            <div className="flex items-center gap-2"><VerdictBadge code={f.verdict?.suggested ?? null} /><span className="text-xs text-ink-faint">{f.verdict?.confidence ? `${f.verdict.confidence} confidence` : ''}{f.verdict?.row ? ` · rule ${f.verdict.row}` : ''}</span></div>
            <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft" data-testid="verdict-reasons">{(f.verdict?.reasons ?? []).map((r) => <li key={r}>{r}</li>)}</ul>
          </div>
          <div data-testid="decision">
            <div className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Decision</div>
            {decision && decision.state !== 'unreviewed' ? (
              <div className="text-sm">
                {decision.state === 'retest_pending' ? <span>Re-test asked for</span> : <VerdictBadge code={decision.verdict} />}
                <span className="text-ink-soft"> · {decision.state.replace('_', ' ')} by {decision.decidedBy} {decision.decidedAt ? `on ${new Date(decision.decidedAt).toLocaleString('en-GB', { timeZone })}` : ''}</span>
                {decision.reason && <p className="text-ink-soft">“{decision.reason}”</p>}
              </div>
            ) : <p className="text-sm text-ink-soft">Not reviewed yet.</p>}
          </div>
          {canDecide && test.role === 'trap' && !frozen && (
            <div className="space-y-2">
              <div className="flex flex-wrap gap-2">
                <button type="button" className="btn-primary" disabled={busy || !f.verdict?.suggested} onClick={() => onDecide({ action: 'confirm' })}>Confirm <kbd className="text-xs opacity-75">C</kbd></button>
                <button type="button" className="btn-quiet" disabled={busy} onClick={() => setOverrideOpen(!overrideOpen)}>Override <kbd className="text-xs opacity-75">O</kbd></button>
                <button type="button" className="btn-quiet" disabled={busy} onClick={() => onDecide({ action: 'retest', reason })}>Ask for a re-test <kbd className="text-xs opacity-75">R</kbd></button>
              </div>
              {overrideOpen && (
                <form className="space-y-2 rounded-md border border-line p-3" onSubmit={(e) => { e.preventDefault(); onDecide({ action: 'override', verdict, reason }); }}>
                  <label className="block"><span className="field-label">Verdict</span>
                    <select className="field-input" value={verdict} onChange={(e) => setVerdict(e.target.value)} autoFocus aria-label="Override verdict">
                      {VERDICT_CODES.map((c) => <option key={c} value={c}>{VERDICT_LABELS[c]}</option>)}
                    </select>
                  </label>
                  <label className="block"><span className="field-label">Why</span>
                    <textarea className="field-input" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} aria-label="Reason" placeholder="What you heard, saw or know that the figures do not show" />
                  </label>
                  <button type="submit" className="btn-primary" disabled={busy || reason.trim().length < 3}>Save override</button>
                </form>
              )}
              {decision && decision.state !== 'unreviewed' && decision.state !== 'retest_pending' && !overrideOpen && (
                <p className="text-xs text-ink-faint">This verdict is decided: changing it needs a reason (use Override).</p>
              )}
            </div>
          )}
          {frozen && <p className="text-xs text-ink-faint">The survey is published: its verdicts are frozen.</p>}
          {error && <p role="alert" className="text-sm text-danger-ink">{error}</p>}
          {detail.trail.length > 0 && (
            <details className="text-xs" open>
              <summary className="cursor-pointer font-semibold text-ink-soft">Changes ({detail.trail.length})</summary>
              <ul className="mt-1 space-y-1" data-testid="verdict-trail">
                {detail.trail.map((e) => {
                  const before = e.before as { verdict?: string; state?: string } | null;
                  const after = e.after as { verdict?: string; state?: string } | null;
                  return <li key={e.id}>{new Date(e.at).toLocaleString('en-GB', { timeZone })} · {e.by} · {e.action.replace('verdict.', '')}: {before?.verdict ?? before?.state ?? 'none'} → {after?.verdict ?? after?.state ?? 'none'}{e.reason ? ` — “${e.reason}”` : ''}</li>;
                })}
              </ul>
            </details>
          )}
        </section>
      </div>
      {trap && <FieldNotes trapId={trap.id} surveyId={test.surveyId} testId={test.id} />}
    </div>
  );
}

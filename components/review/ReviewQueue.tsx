'use client';

import { useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useEffect, useRef, useState } from 'react';
import { VERDICT_CODES, VERDICT_LABELS } from '@/lib/analysis/verdict-codes';
import { TRAP_TYPES, TRAP_TYPE_LABELS } from '@/lib/domain/vocabulary';
import type { ReviewItem, ReviewQueue as Queue, TestDetail } from '@/lib/services/review';
import { TestPanel, type DecideAction } from './TestPanel';
import { VerdictBadge } from './VerdictBadge';
import { useReplaceParams } from '../useReplaceParams';

const STATE_WORDS: Record<ReviewItem['state'], string> = {
  unreviewed: '○ to review', confirmed: '● confirmed', overridden: '◐ overridden', retest_pending: '↻ re-test asked',
};

const KEYS: [string, string][] = [['J / ↓', 'next trap'], ['K / ↑', 'previous trap'], ['C', 'confirm the suggestion'], ['O', 'override: verdict and why'], ['R', 'ask for a re-test'], ['T', 'open the trap'], ['?', 'show or hide these keys']];

const typing = (el: EventTarget | null) => el instanceof HTMLElement && (el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName));

/** The analyst's queue: every trap of the survey worst first, one open beside the list, driven by the keyboard. */
export function ReviewQueue({ siteId, surveyId, areas, canDecide, timeZone }: {
  siteId: number; surveyId: number; areas: { id: number; name: string }[]; canDecide: boolean; timeZone: string;
}) {
  const router = useRouter();
  const replaceParams = useReplaceParams();
  const search = useSearchParams();
  const [queue, setQueue] = useState<Queue | null>(null);
  const [selected, setSelected] = useState(0);
  const [detail, setDetail] = useState<TestDetail | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [overrideOpen, setOverrideOpen] = useState(false);
  const [showKeys, setShowKeys] = useState(true);
  const listRef = useRef<HTMLOListElement>(null);
  const queryString = search.toString();

  const load = useCallback(async () => {
    const res = await fetch(`/api/surveys/${surveyId}/review-queue?${queryString}`);
    const body = await res.json();
    if (!res.ok) return setError(body?.error?.message ?? 'The queue could not be loaded.');
    setQueue(body);
  }, [surveyId, queryString]);

  useEffect(() => { void load(); }, [load]);

  const item = queue?.items[selected] ?? null;
  useEffect(() => {
    if (!item) return setDetail(null);
    let cancelled = false;
    setOverrideOpen(false);
    setError(null);
    fetch(`/api/tests/${item.latestTestId}`).then(async (res) => {
      const body = await res.json();
      if (!cancelled) res.ok ? setDetail(body) : setError(body?.error?.message ?? 'The test could not be loaded.');
    });
    listRef.current?.querySelector(`[data-index="${selected}"]`)?.scrollIntoView({ block: 'nearest' });
    return () => { cancelled = true; };
  }, [item?.latestTestId, item, selected]);

  const decide = useCallback(async (a: DecideAction) => {
    if (!item || !detail) return;
    setBusy(true);
    setError(null);
    const body = a.action === 'retest' ? { trapId: item.trapId, action: 'retest', reason: a.reason || undefined }
      : a.action === 'confirm' ? { trapId: item.trapId, action: 'confirm', testId: item.latestTestId }
      : { trapId: item.trapId, action: 'override', testId: item.latestTestId, verdict: a.verdict, reason: a.reason };
    const res = await fetch(`/api/surveys/${surveyId}/verdicts`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    const reply = await res.json();
    setBusy(false);
    if (!res.ok) {
      setError(reply?.error?.details?.[0]?.message ?? reply?.error?.message ?? 'Not saved.');
      return;
    }
    await load();
    // On to the next trap still to review, below this one if there is one.
    setQueue((q) => {
      if (q) {
        const next = q.items.findIndex((i, idx) => idx > selected && i.state === 'unreviewed');
        setSelected(next >= 0 ? next : Math.min(selected + 1, q.items.length - 1));
      }
      return q;
    });
  }, [item, detail, surveyId, load, selected]);

  useEffect(() => {
    function onKey(e: KeyboardEvent) {
      if (typing(e.target) || e.metaKey || e.ctrlKey || e.altKey) return;
      const count = queue?.items.length ?? 0;
      const k = e.key.toLowerCase();
      if (k === 'j' || e.key === 'ArrowDown') setSelected((s) => Math.min(s + 1, count - 1));
      else if (k === 'k' || e.key === 'ArrowUp') setSelected((s) => Math.max(s - 1, 0));
      else if (k === '?') setShowKeys((v) => !v);
      else if (k === 't' && item) router.push(`/sites/${siteId}/traps/${item.trapId}`);
      else if (canDecide && k === 'c' && detail?.test.suggestedVerdict) void decide({ action: 'confirm' });
      else if (canDecide && k === 'o') setOverrideOpen(true);
      else if (canDecide && k === 'r') void decide({ action: 'retest', reason: '' });
      else return;
      e.preventDefault();
    }
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [queue, item, detail, canDecide, decide, router, siteId]);

  function setFilter(key: string, value: string) {
    setSelected(0);
    replaceParams({ [key]: value || null });
  }

  const c = queue?.counts;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="mr-auto">
          <div className="text-sm font-semibold" data-testid="review-progress">{c ? `${c.reviewed} of ${c.traps} reviewed` : 'Loading…'}</div>
          {c && <div className="text-xs text-ink-soft">{c.unreviewed} to review · {c.retestPending} re-test{c.retestPending === 1 ? '' : 's'} asked</div>}
          {c && <div className="mt-1 h-1.5 w-56 overflow-hidden rounded bg-surface-sunken" aria-hidden="true"><div className="h-full bg-accent-500" style={{ width: `${(100 * c.reviewed) / Math.max(1, c.traps)}%` }} /></div>}
        </div>
        <label><span className="field-label">Area</span>
          <select className="field-input" value={search.get('areaId') ?? ''} onChange={(e) => setFilter('areaId', e.target.value)} aria-label="Area">
            <option value="">All areas</option>{areas.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
          </select></label>
        <label><span className="field-label">Trap type</span>
          <select className="field-input" value={search.get('trapType') ?? ''} onChange={(e) => setFilter('trapType', e.target.value)} aria-label="Trap type">
            <option value="">All types</option>{TRAP_TYPES.map((t) => <option key={t} value={t}>{TRAP_TYPE_LABELS[t]}</option>)}
          </select></label>
        <label><span className="field-label">Verdict</span>
          <select className="field-input" value={search.get('verdict') ?? ''} onChange={(e) => setFilter('verdict', e.target.value)} aria-label="Verdict">
            <option value="">Any verdict</option>{VERDICT_CODES.map((v) => <option key={v} value={v}>{VERDICT_LABELS[v]}</option>)}
          </select></label>
        <label><span className="field-label">Review</span>
          <select className="field-input" value={search.get('reviewed') ?? ''} onChange={(e) => setFilter('reviewed', e.target.value)} aria-label="Review state">
            <option value="">All</option><option value="no">To review</option><option value="yes">Reviewed</option><option value="retest">Re-test asked</option>
          </select></label>
      </div>

      <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
        <div>
        <ol ref={listRef} className="panel max-h-[65vh] overflow-y-auto" aria-label="Traps to review" data-testid="review-list">
          {queue?.items.map((i, idx) => (
            <li key={i.trapId} data-index={idx}>
              <button type="button" onClick={() => setSelected(idx)} aria-current={idx === selected}
                className={`flex w-full flex-col items-start gap-0.5 border-b border-line px-3 py-2 text-left ${idx === selected ? 'bg-accent-50 outline outline-2 -outline-offset-2 outline-accent-500' : 'hover:bg-surface-sunken'}`}>
                <span className="flex w-full justify-between"><span className="tag-text font-semibold">{i.tag}</span><span className="text-xs text-ink-soft">{STATE_WORDS[i.state]}</span></span>
                <span className="flex w-full justify-between gap-2">
                  <VerdictBadge code={i.verdict ?? i.suggested} muted={i.state === 'unreviewed'} />
                  <span className="text-xs text-ink-faint">{i.lossKgPerHour != null ? `${i.lossKgPerHour.toFixed(1)} kg/h` : ''}{i.hasReference ? ' · pipe read' : ''}</span>
                </span>
              </button>
            </li>
          ))}
          {queue && queue.items.length === 0 && <li className="p-4 text-sm text-ink-soft">No trap matches these filters.</li>}
        </ol>
      {showKeys && (
          <aside className="panel mt-3 p-3 text-xs" aria-label="Keyboard" data-testid="key-legend">
            <div className="mb-1 font-semibold">Keys</div>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
              {KEYS.filter(([, what]) => canDecide || !/confirm|override|re-test/.test(what)).map(([key, what]) => (
                <div key={key} className="contents"><dt><kbd className="rounded border border-line-strong bg-surface-sunken px-1 font-mono">{key}</kbd></dt><dd className="text-ink-soft">{what}</dd></div>
              ))}
            </dl>
          </aside>
        )}
        </div>
        <div className="min-w-0">
          {detail ? (
            <TestPanel detail={detail} canDecide={canDecide} onDecide={decide} busy={busy} error={error} overrideOpen={overrideOpen} setOverrideOpen={setOverrideOpen} siteId={siteId} timeZone={timeZone} />
          ) : (
            <p className="panel p-6 text-sm text-ink-soft">{error ?? (queue && queue.items.length === 0 ? 'Nothing to show.' : 'Loading…')}</p>
          )}
        </div>
      </div>

    </div>
  );
}

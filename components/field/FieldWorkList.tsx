'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import { FieldNoteItem, FieldNotes } from '@/components/review/FieldNotes';
import { TRAP_TYPE_LABELS, type TrapType } from '@/lib/domain/vocabulary';
import type { FieldWork } from '@/lib/services/field-notes';

type Item = FieldWork['items'][number];
type Show = 'all' | 'retest' | 'untested' | 'notes';

const SHOW_LABELS: Record<Show, string> = { all: 'All', retest: 'Re-tests', untested: 'Not tested', notes: 'With notes' };

/** Standing in words, with a shape beside it so it reads without colour. */
function Standing({ item }: { item: Item }) {
  const [mark, tone] = item.retestPending
    ? ['↻', 'border-caution-line bg-caution-bg text-caution-ink']
    : !item.tested
      ? item.standing === 'not tested' ? ['○', 'border-line-strong bg-surface-sunken text-ink'] : ['⊘', 'border-line-strong bg-surface-sunken text-ink-soft']
      : ['●', 'border-accent-200 bg-accent-50 text-accent-800'];
  return <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded border px-1.5 py-0.5 text-xs ${tone}`} data-testid="standing"><span aria-hidden="true">{mark}</span>{item.standing}</span>;
}

export function FieldWorkList({ siteId, surveyId, initial, published }: { siteId: number; surveyId: number; initial: FieldWork; published: boolean }) {
  const [work, setWork] = useState(initial);
  const [show, setShow] = useState<Show>(initial.counts.retestPending > 0 ? 'retest' : 'all');
  const [search, setSearch] = useState('');
  const [open, setOpen] = useState<number | null>(null);
  const [busy, setBusy] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function reload() {
    const res = await fetch(`/api/surveys/${surveyId}/field-work`, { cache: 'no-store' });
    if (res.ok) setWork(await res.json());
  }

  async function notReachable(item: Item) {
    setBusy(item.trapId);
    setError(null);
    const res = await fetch(`/api/surveys/${surveyId}/traps/${item.trapId}/field-notes`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ kind: 'not_reachable' }),
    });
    setBusy(null);
    if (!res.ok) {
      const body = await res.json().catch(() => null);
      setError(`${item.tag}: ${body?.error?.message ?? `the server answered ${res.status}`}`);
      return;
    }
    await reload();
  }

  const items = useMemo(() => {
    const q = search.trim().toUpperCase();
    return work.items.filter((i) =>
      (show === 'all' || (show === 'retest' && i.retestPending) || (show === 'untested' && !i.tested) || (show === 'notes' && i.notes.length > 0))
      && (!q || i.tag.toUpperCase().includes(q) || (i.areaName ?? '').toUpperCase().includes(q) || (i.location ?? '').toUpperCase().includes(q)));
  }, [work, show, search]);

  const counts: Record<Show, number> = { all: work.items.length, retest: work.counts.retestPending, untested: work.counts.untested, notes: work.counts.withNotes };

  return (
    <div className="space-y-3" data-testid="field-work">
      <div className="flex flex-wrap items-end gap-3">
        <div role="tablist" aria-label="Show" className="flex flex-wrap gap-1">
          {(Object.keys(SHOW_LABELS) as Show[]).map((s) => (
            <button key={s} type="button" role="tab" aria-selected={show === s} onClick={() => setShow(s)}
              className={show === s ? 'btn-primary' : 'btn-quiet'}>{SHOW_LABELS[s]} <span className="opacity-75">{counts[s]}</span></button>
          ))}
        </div>
        <label className="ml-auto block w-56"><span className="field-label">Find a trap</span>
          <input className="field-input" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Tag, area or location" aria-label="Find a trap" />
        </label>
      </div>
      {published && <p className="text-sm text-ink-soft">This survey is published: its notes are kept as they were and no longer change.</p>}
      {error && <p role="alert" className="field-error">{error}</p>}
      {items.length === 0 ? <p className="panel p-4 text-sm text-ink-soft">Nothing to show here.</p> : (
        <ul className="space-y-2" data-testid="field-traps">
          {items.map((item) => (
            <li key={item.trapId} className="panel p-3" data-testid="field-trap" data-tag={item.tag}>
              <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <Link href={`/sites/${siteId}/traps/${item.trapId}`} className="tag-text font-semibold text-accent-700 hover:underline">{item.tag}</Link>
                <Standing item={item} />
                <span className="text-sm text-ink-soft">{item.areaName ?? 'no area'}{item.location ? ` · ${item.location}` : ''} · {TRAP_TYPE_LABELS[item.trapType as TrapType] ?? item.trapType} · {item.pressureBarg} barg</span>
                <span className="ml-auto flex gap-2">
                  {work.canAdd && !item.tested && !item.notes.some((n) => n.kind === 'not_reachable') && (
                    <button type="button" className="btn-quiet" disabled={busy === item.trapId} onClick={() => notReachable(item)}>Not reachable</button>
                  )}
                  <button type="button" className="btn-quiet" aria-expanded={open === item.trapId} onClick={() => setOpen(open === item.trapId ? null : item.trapId)}>
                    {open === item.trapId ? 'Close' : work.canAdd ? 'Notes…' : 'Show notes'}
                  </button>
                </span>
              </div>
              {open === item.trapId ? (
                <div className="mt-2"><FieldNotes surveyId={surveyId} trapId={item.trapId} onChanged={reload} /></div>
              ) : item.notes.length > 0 && (
                <ul className="mt-1">{item.notes.slice(0, 3).map((n) => <FieldNoteItem key={n.id} note={n} />)}</ul>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

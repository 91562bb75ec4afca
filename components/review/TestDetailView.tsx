'use client';

import { useEffect, useState } from 'react';
import type { TestDetail } from '@/lib/services/review';
import { TestPanel, type DecideAction } from './TestPanel';

/** One test on a page of its own (a link from a trap's history or the API), with the same panel as the queue. */
export function TestDetailView({ testId, siteId, canDecide, timeZone }: { testId: number; siteId: number; canDecide: boolean; timeZone: string }) {
  const [detail, setDetail] = useState<TestDetail | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [overrideOpen, setOverrideOpen] = useState(false);

  async function load() {
    const res = await fetch(`/api/tests/${testId}`);
    const body = await res.json();
    if (res.ok) setDetail(body);
    else setError(body?.error?.message ?? 'The test could not be loaded.');
  }
  useEffect(() => { void load(); }, [testId]); // eslint-disable-line react-hooks/exhaustive-deps

  async function decide(a: DecideAction) {
    if (!detail?.trap) return;
    setBusy(true);
    const body = a.action === 'retest' ? { trapId: detail.trap.id, action: 'retest', reason: a.reason || undefined }
      : a.action === 'confirm' ? { trapId: detail.trap.id, action: 'confirm', testId }
      : { trapId: detail.trap.id, action: 'override', testId, verdict: a.verdict, reason: a.reason };
    const res = await fetch(`/api/surveys/${detail.test.surveyId}/verdicts`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    const reply = await res.json();
    setBusy(false);
    if (!res.ok) return setError(reply?.error?.details?.[0]?.message ?? reply?.error?.message ?? 'Not saved.');
    setOverrideOpen(false);
    setError(null);
    await load();
  }

  if (!detail) return <p className="panel p-6 text-sm text-ink-soft">{error ?? 'Loading…'}</p>;
  return <TestPanel detail={detail} canDecide={canDecide} onDecide={decide} busy={busy} error={error} overrideOpen={overrideOpen} setOverrideOpen={setOverrideOpen} siteId={siteId} timeZone={timeZone} />;
}

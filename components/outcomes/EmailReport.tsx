'use client';

import { useState } from 'react';

/** Sends a published survey to the site's viewers (figures and links; the file stays behind sign-in). */
export function EmailReport({ surveyId }: { surveyId: number }) {
  const [state, setState] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function send() {
    setBusy(true);
    const res = await fetch(`/api/surveys/${surveyId}/report-email`, { method: 'POST' });
    const body = await res.json();
    setBusy(false);
    if (!res.ok) return setState(body?.error?.message ?? 'Not sent.');
    const sent = (body.recipients as { email: string; sent: boolean }[]).filter((r) => r.sent);
    setState(`Sent to ${sent.length} viewer${sent.length === 1 ? '' : 's'}: ${sent.map((r) => r.email).join(', ')}.`);
  }
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      <button type="button" className="btn-quiet" disabled={busy} onClick={send}>E-mail to the site&apos;s viewers</button>
      {state && <span role="status" className="text-ink-soft">{state}</span>}
    </div>
  );
}

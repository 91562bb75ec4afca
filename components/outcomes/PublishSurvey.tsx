'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';

/** Publishing freezes the survey; undecided verdicts must be reviewed first or accepted explicitly. */
export function PublishSurvey({ surveyId, undecided }: { surveyId: number; undecided: number }) {
  const router = useRouter();
  const [accept, setAccept] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function publish() {
    setBusy(true);
    const res = await fetch(`/api/surveys/${surveyId}/publish`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ acceptUndecided: accept }) });
    setBusy(false);
    if (!res.ok) return setError((await res.json())?.error?.message ?? 'Not published.');
    router.refresh();
  }
  return (
    <div className="space-y-2 text-sm">
      {undecided > 0 && (
        <label className="flex items-start gap-2">
          <input type="checkbox" checked={accept} onChange={(e) => setAccept(e.target.checked)} className="mt-1" />
          <span>{undecided} tested trap{undecided === 1 ? ' has' : 's have'} no confirmed verdict. Publish with the suggested verdict{undecided === 1 ? '' : 's'} for {undecided === 1 ? 'it' : 'them'}.</span>
        </label>
      )}
      <button type="button" className="btn-primary" disabled={busy || (undecided > 0 && !accept)} onClick={publish}>Publish survey</button>
      <p className="text-xs text-ink-faint">Publishing freezes the verdicts and figures with today&apos;s cost settings. It cannot be undone.</p>
      {error && <p role="alert" className="text-danger-ink">{error}</p>}
    </div>
  );
}

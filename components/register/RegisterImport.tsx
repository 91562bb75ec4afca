'use client';

import Link from 'next/link';
import { useState } from 'react';
import type { RegisterPlan } from '@/lib/services/register-import';

type Stage = { kind: 'idle' } | { kind: 'planned'; plan: RegisterPlan } | { kind: 'applied'; plan: RegisterPlan };

const ACTION_LABEL = { create: 'New', update: 'Changes', unchanged: 'Unchanged' } as const;

async function post(url: string, body: unknown) {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  const json = await res.json();
  if (!res.ok) return { error: json.error as { message: string; details?: unknown } };
  return { plan: json as RegisterPlan };
}

export function RegisterImport({ siteId }: { siteId: number }) {
  const [fileName, setFileName] = useState<string | null>(null);
  const [csv, setCsv] = useState<string | null>(null);
  const [stage, setStage] = useState<Stage>({ kind: 'idle' });
  const [error, setError] = useState<string | null>(null);
  const [skipRejected, setSkipRejected] = useState(false);
  const [busy, setBusy] = useState(false);

  async function choose(file: File | undefined) {
    setStage({ kind: 'idle' });
    setError(null);
    setSkipRejected(false);
    if (!file) return;
    const text = await file.text();
    if (text.includes('\uFFFD')) {
      setError(`${file.name} is not valid UTF-8 text. Save it from the spreadsheet as "CSV UTF-8" and choose it again.`);
      return;
    }
    setFileName(file.name);
    setCsv(text);
    setBusy(true);
    const result = await post(`/api/sites/${siteId}/register-imports/preview`, { csv: text, fileName: file.name });
    setBusy(false);
    if (result.error) setError(result.error.message);
    else setStage({ kind: 'planned', plan: result.plan });
  }

  async function apply() {
    if (!csv) return;
    setBusy(true);
    const result = await post(`/api/sites/${siteId}/register-imports`, { csv, fileName, skipRejectedRows: skipRejected });
    setBusy(false);
    if (result.error) setError(result.error.message);
    else setStage({ kind: 'applied', plan: result.plan });
  }

  const plan = stage.kind === 'idle' ? null : stage.plan;
  const rowProblems = plan?.problems.filter((p) => p.severity === 'error' && p.line > 1) ?? [];
  const writes = plan ? plan.counts.create + plan.counts.update : 0;

  return (
    <div className="space-y-4">
      <section className="panel space-y-3 p-5">
        <p className="text-sm text-ink-soft">
          One row per trap. Columns: <code className="tag-text">tag, area, location, trap_type, application, size_dn, orifice_mm, pressure_barg, discharges_to, criticality, status</code>.
          Only <code className="tag-text">tag</code>, <code className="tag-text">trap_type</code> and <code className="tag-text">pressure_barg</code> are required.
          Rows are matched by tag: new tags are added, known tags are updated, nothing is deleted (mark a trap <code className="tag-text">removed</code> instead).
          You will see what would change before anything is written.
        </p>
        <label className="block">
          <span className="field-label">Register file (CSV, UTF-8)</span>
          <input type="file" accept=".csv,text/csv" className="mt-1 block text-sm" onChange={(e) => choose(e.target.files?.[0])} data-testid="register-file" />
        </label>
        {busy && <p className="text-sm text-ink-soft">Reading…</p>}
        {error && <p role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">{error}</p>}
      </section>

      {plan && (
        <section className="panel space-y-4 p-5" data-testid="register-plan">
          <h2 className="font-semibold">{stage.kind === 'applied' ? `Imported ${fileName}` : `What importing ${fileName} would do`}</h2>
          <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-5">
            <div><dt className="text-ink-soft">New traps</dt><dd className="text-xl font-semibold">{plan.counts.create}</dd></div>
            <div><dt className="text-ink-soft">Changed</dt><dd className="text-xl font-semibold">{plan.counts.update}</dd></div>
            <div><dt className="text-ink-soft">Unchanged</dt><dd className="text-xl font-semibold">{plan.counts.unchanged}</dd></div>
            <div><dt className="text-ink-soft">Rows with problems</dt><dd className="text-xl font-semibold">{plan.counts.rejected}</dd></div>
            <div><dt className="text-ink-soft">New areas</dt><dd className="text-xl font-semibold">{plan.newAreas.length}</dd></div>
          </dl>
          {plan.newAreas.length > 0 && <p className="text-sm">New areas: {plan.newAreas.join(', ')}</p>}

          {plan.problems.length > 0 && (
            <div>
              <h3 className="mb-2 text-sm font-semibold">Problems</h3>
              <table className="data-table" data-testid="register-problems">
                <thead><tr><th>Line</th><th>Column</th><th>Problem</th><th /></tr></thead>
                <tbody>
                  {plan.problems.map((p, i) => (
                    <tr key={i}>
                      <td>{p.line}</td><td className="tag-text">{p.column ?? ''}</td><td>{p.message}</td>
                      <td className="text-xs">{p.severity === 'error' ? '✕ row not imported' : '! ignored'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}

          {stage.kind === 'planned' && (
            <div className="space-y-2">
              {rowProblems.length > 0 && !plan.blocked && (
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" checked={skipRejected} onChange={(e) => setSkipRejected(e.target.checked)} />
                  Import the other rows and skip the {plan.counts.rejected} with problems
                </label>
              )}
              <button type="button" className="btn-primary" disabled={busy || plan.blocked || writes === 0 || (rowProblems.length > 0 && !skipRejected)} onClick={apply}>
                {plan.blocked ? 'Fix the header to import' : `Import ${writes} trap${writes === 1 ? '' : 's'}`}
              </button>
            </div>
          )}
          {stage.kind === 'applied' && <Link href={`/sites/${siteId}/traps`} className="btn-quiet">Open the register</Link>}

          <details open={plan.rows.length <= 30}>
            <summary className="cursor-pointer text-sm font-semibold">Rows ({plan.rows.length})</summary>
            <table className="data-table mt-2">
              <thead><tr><th>Line</th><th>Tag</th><th>Action</th><th>What changes</th></tr></thead>
              <tbody>
                {plan.rows.map((r) => (
                  <tr key={r.line}>
                    <td>{r.line}</td><td className="tag-text">{r.tag}</td><td>{ACTION_LABEL[r.action]}</td>
                    <td className="text-ink-soft">{Object.entries(r.changes).map(([k, [a, b]]) => `${k}: ${a ?? '—'} → ${b ?? '—'}`).join('; ')}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        </section>
      )}
    </div>
  );
}

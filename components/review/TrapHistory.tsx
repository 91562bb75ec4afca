'use client';

import Link from 'next/link';
import { useEffect, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { TrapHistory as History } from '@/lib/services/review';
import { VerdictBadge } from './VerdictBadge';

type Point = { label: string; value: number | null };

/** One small trend across surveys (x: the surveys in order). */
function Trend({ title, unit, points }: { title: string; unit: string; points: Point[] }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = host.current!;
    const labels = points.map((p) => p.label);
    const plot = new uPlot({
      width: el.clientWidth || 260, height: 140, legend: { show: false }, cursor: { show: false },
      scales: { x: { time: false, range: [-0.5, Math.max(0.5, points.length - 0.5)] } },
      axes: [
        { splits: () => points.map((_, i) => i), values: (_u, splits) => splits.map((i) => labels[i] ?? ''), stroke: '#4d5652', grid: { show: false }, size: 30 },
        { stroke: '#4d5652', grid: { stroke: '#eceee9' }, size: 42 },
      ],
      series: [{}, { stroke: '#137067', width: 1.5, points: { size: 7, fill: '#137067' } }],
    }, [points.map((_, i) => i), points.map((p) => p.value)] as uPlot.AlignedData, el);
    return () => plot.destroy();
  }, [points]);
  return (
    <figure className="panel p-3">
      <figcaption className="mb-1 text-xs font-semibold text-ink-soft">{title} ({unit})</figcaption>
      <div ref={host} />
    </figure>
  );
}

/** A trap's surveys side by side: the decision or suggestion, every trap-point test, and trends. */
export function TrapHistory({ trapId, siteId }: { trapId: number; siteId: number }) {
  const [history, setHistory] = useState<History | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    fetch(`/api/traps/${trapId}/history`).then(async (res) => {
      const body = await res.json();
      res.ok ? setHistory(body.items) : setError(body?.error?.message ?? 'History could not be loaded.');
    });
  }, [trapId]);
  if (error) return <p role="alert" className="text-sm text-danger-ink">{error}</p>;
  if (!history) return <p className="text-sm text-ink-soft">Loading…</p>;
  if (history.length === 0) return <p className="text-sm text-ink-soft">No test of this trap has been imported yet. Tests appear here, survey by survey, once meter files are uploaded.</p>;
  const last = (s: History[number]) => s.tests[s.tests.length - 1];
  // Survey start months as labels: names are too long for a small plot's axis.
  const series = (pick: (t: History[number]['tests'][number]) => number | null) => history.map((s) => ({ label: s.startsOn.slice(0, 7), value: s.tests.length ? pick(last(s)) : null }));
  return (
    <div className="space-y-4" data-testid="trap-history">
      <table className="data-table">
        <thead><tr><th>Survey</th><th>Verdict</th><th>Tests</th><th className="text-right">Mean level</th><th className="text-right">Duty cycle</th><th className="text-right">Surface</th><th className="text-right">Loss</th></tr></thead>
        <tbody>
          {history.map((s) => {
            const t = s.tests.length ? last(s) : null;
            return (
              <tr key={s.surveyId}>
                <td><div className="font-medium">{s.surveyName}</div><div className="text-xs text-ink-faint">{s.startsOn} · {s.status.replace('_', ' ')}</div></td>
                <td>
                  {s.decision?.state === 'retest' ? <span className="text-xs">↻ re-test asked</span>
                    : s.decision ? <span><VerdictBadge code={s.decision.verdict} /> <span className="text-xs text-ink-faint">{s.decision.state}</span></span>
                    : <span><VerdictBadge code={t?.suggestedVerdict ?? null} muted /> <span className="text-xs text-ink-faint">suggested</span></span>}
                </td>
                <td className="space-x-2">{s.tests.map((x, i) => <Link key={x.id} href={`/sites/${siteId}/tests/${x.id}`} className="text-sm text-accent-700 hover:underline">{i === s.tests.length - 1 && s.tests.length > 1 ? 'latest' : `#${i + 1}`}</Link>)}</td>
                <td className="text-right">{t?.meanLevelDb != null ? `${t.meanLevelDb.toFixed(1)} dB` : '—'}</td>
                <td className="text-right">{t?.dutyCycle != null ? `${Math.round(t.dutyCycle * 100)} %` : '—'}</td>
                <td className="text-right">{t?.meanTemperatureC != null ? `${t.meanTemperatureC.toFixed(0)} °C` : '—'}</td>
                <td className="text-right">{t?.lossKgPerHour != null ? `${t.lossKgPerHour.toFixed(1)} kg/h` : '—'}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {history.length > 1 && (
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <Trend title="Mean level" unit="dB" points={series((t) => t.meanLevelDb)} />
          <Trend title="Duty cycle" unit="%" points={series((t) => (t.dutyCycle == null ? null : t.dutyCycle * 100))} />
          <Trend title="Surface temperature" unit="°C" points={series((t) => t.meanTemperatureC)} />
          <Trend title="Estimated loss" unit="kg/h" points={series((t) => t.lossKgPerHour ?? 0)} />
        </div>
      )}
    </div>
  );
}

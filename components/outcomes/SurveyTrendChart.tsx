'use client';

import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

export type TrendPoint = { label: string; failureRate: number | null; lossKgPerHour: number };

/** Failure rate (%, left) and steam lost (right) for each survey in order: is the plant getting better? */
export function SurveyTrendChart({ points, lossUnit, lossScale }: { points: TrendPoint[]; lossUnit: string; lossScale: number }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = host.current!;
    const labels = points.map((p) => p.label);
    const plot = new uPlot({
      width: el.clientWidth || 600, height: 220, legend: { show: false },
      scales: { x: { time: false, range: [-0.5, Math.max(0.5, points.length - 0.5)] }, rate: { range: (_u, _min, max) => [0, Math.max(10, Math.ceil(max / 5) * 5)] }, loss: { range: (_u, _min, max) => [0, Math.max(1, max * 1.15)] } },
      axes: [
        { splits: () => points.map((_, i) => i), values: (_u, splits) => splits.map((i) => labels[i] ?? ''), stroke: '#4d5652', grid: { show: false } },
        { scale: 'rate', label: 'failure rate (%)', stroke: '#137067', grid: { stroke: '#eceee9' } },
        { scale: 'loss', label: `steam lost (${lossUnit})`, side: 1, stroke: '#a35200', grid: { show: false } },
      ],
      series: [
        {},
        { label: 'failure rate', scale: 'rate', stroke: '#137067', width: 2, points: { size: 8, fill: '#137067' } },
        { label: 'steam lost', scale: 'loss', stroke: '#a35200', width: 2, dash: [6, 4], points: { size: 8, fill: '#a35200' } },
      ],
    }, [points.map((_, i) => i), points.map((p) => (p.failureRate === null ? null : p.failureRate * 100)), points.map((p) => p.lossKgPerHour * lossScale)] as uPlot.AlignedData, el);
    return () => plot.destroy();
  }, [points, lossUnit, lossScale]);
  return (
    <figure>
      <div ref={host} data-testid="trend-chart" />
      <figcaption className="text-xs text-ink-soft"><span style={{ color: '#137067' }}>━●</span> failure rate · <span style={{ color: '#a35200' }}>╍●</span> steam lost</figcaption>
    </figure>
  );
}

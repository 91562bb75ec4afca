'use client';

import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

type Series = { t: number[]; levelDb: (number | null)[]; temperatureC: (number | null)[] | null };

/** A small plot of one normalised test: level (dB) and, on a second axis, surface temperature (°C). */
export function PreviewChart({ series, title }: { series: Series; title: string }) {
  const box = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const hasTemp = series.temperatureC !== null && series.temperatureC.some((v) => v !== null);
    const options: uPlot.Options = {
      width: Math.max(280, el.clientWidth),
      height: 220,
      legend: { show: false },
      cursor: { drag: { x: false, y: false } },
      scales: { x: { time: false } },
      axes: [
        { label: 's from start', size: 36, stroke: '#4d5652', grid: { stroke: '#e2e3de' } },
        { label: 'Level (dB)', scale: 'dB', stroke: '#4d5652', grid: { stroke: '#e2e3de' } },
        ...(hasTemp ? [{ label: 'Surface (°C)', scale: 'C', side: 1 as const, size: 56, stroke: '#4d5652', grid: { show: false } }] : []),
      ],
      series: [
        { label: 'Time (s)' },
        { label: 'Level (dB)', scale: 'dB', stroke: '#137067', width: 1.25 },
        ...(hasTemp ? [{ label: 'Surface (°C)', scale: 'C', stroke: '#d55e00', width: 1.25, dash: [6, 3] }] : []),
      ],
    };
    const data: uPlot.AlignedData = hasTemp ? [series.t, series.levelDb, series.temperatureC!] : [series.t, series.levelDb];
    const plot = new uPlot(options, data, el);
    const resize = new ResizeObserver(() => plot.setSize({ width: Math.max(280, el.clientWidth), height: 220 }));
    resize.observe(el);
    return () => {
      resize.disconnect();
      plot.destroy();
    };
  }, [series]);

  const hasTemp = series.temperatureC !== null && series.temperatureC.some((v) => v !== null);
  return (
    <figure>
      <div ref={box} role="img" aria-label={title} data-testid="preview-chart" className="w-full" />
      <figcaption className="mt-1 flex gap-4 text-xs text-ink-soft">
        <span><span aria-hidden="true" className="text-accent-600">━</span> Level (dB, left)</span>
        {hasTemp && <span><span aria-hidden="true" className="text-[#d55e00]">┅</span> Surface temperature (°C, right)</span>}
      </figcaption>
    </figure>
  );
}

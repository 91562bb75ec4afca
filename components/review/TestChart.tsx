'use client';

import { useEffect, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

type Series = { t: number[]; levelDb: (number | null)[]; temperatureC: (number | null)[] | null; decimated: boolean; sampleCount: number };
export type ChartFigures = { quietMaxDb: number | null; liveSteamMinDb: number | null; openSpansS: [number, number][] };

async function fetchSeries(testId: number, window?: [number, number]): Promise<Series> {
  const q = window ? `?from=${window[0]}&to=${window[1]}&points=2000` : '?points=2000';
  const res = await fetch(`/api/tests/${testId}/series${q}`);
  if (!res.ok) throw new Error((await res.json())?.error?.message ?? `Readings could not be loaded (${res.status}).`);
  return res.json();
}

/** The reference reading drawn on the trap test's time axis, sampled where the trap's readings are. */
function alignTo(t: number[], ref: Series | null): (number | null)[] | null {
  if (!ref || ref.t.length === 0) return null;
  const refEnd = ref.t[ref.t.length - 1];
  let j = 0;
  return t.map((x) => {
    if (x > refEnd) return null;
    while (j < ref.t.length - 1 && ref.t[j + 1] <= x) j++;
    return ref.levelDb[j];
  });
}

const BAND_FILL = { quiet: 'rgba(0,114,178,0.06)', condensate: 'rgba(230,159,0,0.06)', live: 'rgba(213,94,0,0.08)' };

/**
 * Level (dB, left) and surface temperature (°C, right) of one test; the three bands shaded with
 * their names, open intervals shaded, the reference reading dashed. Drag to zoom (the zoomed
 * window is fetched at full resolution), double-click to see the whole test.
 */
export function TestChart({ testId, referenceTestId, figures, onDrawn }: {
  testId: number; referenceTestId: number | null; figures: ChartFigures; onDrawn?: (ms: number) => void;
}) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [readout, setReadout] = useState<string>('');
  const [resolution, setResolution] = useState<string>('');

  useEffect(() => {
    let cancelled = false;
    let whole: Series | null = null;
    let reference: Series | null = null;
    const el = host.current!;

    function data(s: Series): uPlot.AlignedData {
      return [s.t, s.levelDb, s.temperatureC ?? s.t.map(() => null), alignTo(s.t, reference) ?? s.t.map(() => null)] as uPlot.AlignedData;
    }

    function drawBands(u: uPlot) {
      const { ctx } = u;
      const { left, top, width, height } = u.bbox;
      const y = (v: number) => u.valToPos(v, 'db', true);
      ctx.save();
      ctx.beginPath();
      ctx.rect(left, top, width, height);
      ctx.clip();
      const yMin = u.scales.db.min ?? 0;
      const yMax = u.scales.db.max ?? 100;
      const bands: [string, string, number, number][] = [];
      if (figures.quietMaxDb !== null) bands.push(['quiet band', BAND_FILL.quiet, yMin, figures.quietMaxDb]);
      if (figures.quietMaxDb !== null && figures.liveSteamMinDb !== null) bands.push(['condensate band', BAND_FILL.condensate, figures.quietMaxDb, figures.liveSteamMinDb]);
      if (figures.liveSteamMinDb !== null) bands.push(['live-steam band', BAND_FILL.live, figures.liveSteamMinDb, yMax]);
      ctx.font = `${11 * devicePixelRatio}px sans-serif`;
      for (const [label, fill, lo, hi] of bands) {
        const y0 = y(Math.max(lo, yMin));
        const y1 = y(Math.min(hi, yMax));
        if (!(y0 > y1)) continue;
        ctx.fillStyle = fill;
        ctx.fillRect(left, y1, width, y0 - y1);
        ctx.fillStyle = 'rgba(60,66,63,0.75)';
        ctx.fillText(label, left + 6 * devicePixelRatio, y1 + 14 * devicePixelRatio);
      }
      ctx.fillStyle = 'rgba(19,112,103,0.10)';
      for (const [a, b] of figures.openSpansS) {
        const x0 = u.valToPos(a, 'x', true);
        const x1 = u.valToPos(b, 'x', true);
        ctx.fillRect(x0, top, Math.max(1, x1 - x0), height);
      }
      ctx.restore();
    }

    async function zoomTo(min: number, max: number) {
      if (!whole || !whole.decimated) return;
      const part = await fetchSeries(testId, [min, max]);
      if (cancelled || !plot.current) return;
      plot.current.setData(data(part), false);
      setResolution(part.decimated ? 'zoomed, still thinned' : `zoomed: every reading (${part.t.length})`);
    }

    (async () => {
      try {
        [whole, reference] = await Promise.all([fetchSeries(testId), referenceTestId ? fetchSeries(referenceTestId) : Promise.resolve(null)]);
        if (cancelled) return;
        const started = performance.now();
        const opts: uPlot.Options = {
          width: el.clientWidth || 800,
          height: 300,
          scales: { x: { time: false }, db: { auto: true }, degC: { auto: true } },
          axes: [
            { label: 'seconds from start', stroke: '#4d5652', grid: { stroke: '#eceee9' } },
            { scale: 'db', label: 'level (dB)', stroke: '#4d5652', grid: { stroke: '#eceee9' } },
            { scale: 'degC', label: 'surface (°C)', side: 1, stroke: '#8a4f00', grid: { show: false } },
          ],
          series: [
            { label: 's', value: (_u, v) => (v == null ? '–' : v.toFixed(2)) },
            { label: 'level dB', scale: 'db', stroke: '#137067', width: 1.25, value: (_u, v) => (v == null ? '–' : v.toFixed(1)) },
            { label: 'surface °C', scale: 'degC', stroke: '#b36b00', width: 1.25, value: (_u, v) => (v == null ? '–' : v.toFixed(1)) },
            { label: 'pipe beside it dB', scale: 'db', stroke: '#7b847f', width: 1, dash: [5, 4], show: !!reference, value: (_u, v) => (v == null ? '–' : v.toFixed(1)) },
          ],
          legend: { show: false },
          cursor: { drag: { x: true, y: false } },
          hooks: {
            drawClear: [drawBands],
            setCursor: [(u) => {
              const i = u.cursor.idx;
              if (i == null) return setReadout('');
              const [t, level, temp, ref] = [0, 1, 2, 3].map((k) => u.data[k][i]);
              setReadout(`${Number(t).toFixed(2)} s · level ${level ?? '–'} dB${temp != null ? ` · surface ${temp} °C` : ''}${ref != null ? ` · pipe ${ref} dB` : ''}`);
            }],
            setSelect: [(u) => {
              if (u.select.width < 5) return;
              const min = u.posToVal(u.select.left, 'x');
              const max = u.posToVal(u.select.left + u.select.width, 'x');
              u.setScale('x', { min, max });
              u.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
              void zoomTo(min, max);
            }],
          },
        };
        plot.current?.destroy();
        plot.current = new uPlot(opts, data(whole), el);
        const drawnMs = performance.now() - started;
        onDrawn?.(drawnMs);
        // For scripts/bench (npm run bench:review): the same figure, observable from outside React.
        window.dispatchEvent(new CustomEvent('plumeward:chart-drawn', { detail: { testId, ms: drawnMs, points: whole.t.length, sampleCount: whole.sampleCount } }));
        setResolution(whole.decimated ? `${whole.sampleCount.toLocaleString('en-GB')} readings, thinned to ${whole.t.length} points (min/max)` : `${whole.sampleCount} readings`);
        el.ondblclick = () => {
          if (!whole || !plot.current) return;
          plot.current.setData(data(whole));
          setResolution(whole.decimated ? `${whole.sampleCount.toLocaleString('en-GB')} readings, thinned to ${whole.t.length} points (min/max)` : `${whole.sampleCount} readings`);
        };
      } catch (err) {
        if (!cancelled) setError((err as Error).message);
      }
    })();
    const resize = () => plot.current?.setSize({ width: el.clientWidth, height: 300 });
    window.addEventListener('resize', resize);
    return () => {
      cancelled = true;
      window.removeEventListener('resize', resize);
      plot.current?.destroy();
      plot.current = null;
    };
  }, [testId, referenceTestId, figures, onDrawn]);

  return (
    <figure className="space-y-1">
      <div ref={host} className="w-full" data-testid="test-chart" />
      {error && <p role="alert" className="text-sm text-danger-ink">{error}</p>}
      <figcaption className="flex flex-wrap justify-between gap-2 text-xs text-ink-soft">
        <span>
          <span className="mr-3"><span aria-hidden="true" style={{ color: '#137067' }}>━</span> level</span>
          <span className="mr-3"><span aria-hidden="true" style={{ color: '#b36b00' }}>━</span> surface temperature</span>
          {referenceTestId && <span className="mr-3"><span aria-hidden="true" style={{ color: '#7b847f' }}>╍</span> pipe beside it (reference)</span>}
          <span className="mr-3"><span aria-hidden="true" className="inline-block h-2.5 w-3 align-middle" style={{ background: 'rgba(19,112,103,0.25)' }} /> open intervals</span>
          drag to zoom · double-click for the whole test
        </span>
        <span data-testid="chart-readout">{readout || resolution}</span>
      </figcaption>
    </figure>
  );
}

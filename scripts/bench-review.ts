/**
 * Review benchmark (issue 5 "Speed"): a throwaway database with a survey of 2,000 traps and one
 * test of 1.5 million samples (made by the server's own import), the built app served on
 * loopback, and headless Chromium (Debian's, driven by playwright-core) measuring:
 *  - opening the long test's page until its chart is drawn (navigation start → the frame after the
 *    chart's `plumeward:chart-drawn` event), and from the series response's end to that frame
 *    (JSON parse, React, uPlot; target ≤ 100 ms), with the chart's own onDrawn figure beside it;
 *  - the decimated series' size in bytes as the server sends it;
 *  - the review queue page of the 2,000-trap survey until its progress count shows.
 *
 *   npm run bench:review [-- --small]
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { DEMO_PASSWORDS, DEMO_USERS } from '../seeders/demo-scenario';
import { isMain, report, runWorker, serveApp, signInCookie, throwawayData, type Figure } from './bench/common';

const BENCH = 'review';
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const ROUNDS = 3;

export async function runReview(opts: { small?: boolean } = {}): Promise<Figure[]> {
  const traps = opts.small ? 200 : 2000;
  const bigSamples = opts.small ? 150_000 : 1_500_000;
  const data = throwawayData('review');
  let t0 = performance.now();
  const seeded = runWorker<{ siteId: number; surveyId: number; longTestId: number; longSamples: number; tests: number; status: string }>(
    'seed-review-worker.ts', [String(traps), String(bigSamples)], data.env,
  );
  console.log(`seeded in ${((performance.now() - t0) / 1000).toFixed(1)} s: survey ${seeded.surveyId} with ${seeded.tests} tests, long test ${seeded.longTestId} of ${seeded.longSamples} samples (upload ${seeded.status})`);
  const app = await serveApp(data.env);
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'plumeward-chromium-'));
  try {
    const email = DEMO_USERS.find((u) => u.role === 'analyst')!.email;
    const cookie = await signInCookie(app.baseUrl, email, DEMO_PASSWORDS.analyst);
    // The series as the chart asks for it, its size as sent.
    t0 = performance.now();
    const seriesRes = await fetch(`${app.baseUrl}/api/tests/${seeded.longTestId}/series?points=2000`, { headers: { cookie } });
    const seriesBytes = (await seriesRes.arrayBuffer()).byteLength;
    const seriesMs = performance.now() - t0;

    const context = await chromium.launchPersistentContext(userDataDir, {
      executablePath: CHROMIUM, headless: true, viewport: { width: 1280, height: 860 },
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    await context.addCookies(cookie.split('; ').map((c) => {
      const eq = c.indexOf('=');
      return { name: c.slice(0, eq), value: c.slice(eq + 1), url: app.baseUrl };
    }));
    const page = await context.newPage();
    await page.addInitScript(() => {
      // uPlot may finish its drawing in a microtask after the constructor returns: the next frame
      // (and a task after it) is when the pixels are surely there.
      window.addEventListener('plumeward:chart-drawn', (e) => {
        const detail = (e as CustomEvent).detail;
        requestAnimationFrame(() => setTimeout(() => {
          const series = performance.getEntriesByType('resource').filter((r) => r.name.includes(`/api/tests/${detail.testId}/series`));
          const dataAt = series.length ? (series[series.length - 1] as PerformanceResourceTiming).responseEnd : NaN;
          const at = performance.now();
          (window as unknown as { __drawn: unknown[] }).__drawn = [...((window as unknown as { __drawn?: unknown[] }).__drawn ?? []), { ...detail, at, afterData: at - dataAt }];
        }, 0));
      });
    });
    const open: number[] = [];
    const draw: number[] = [];
    const afterData: number[] = [];
    let points = 0;
    for (let i = 0; i < ROUNDS + 1; i++) {
      await page.goto(`${app.baseUrl}/sites/${seeded.siteId}/tests/${seeded.longTestId}`);
      const d = await page.waitForFunction(() => (window as unknown as { __drawn?: { ms: number; at: number; points: number }[] }).__drawn?.[0], null, { timeout: 60_000 });
      const { ms, at, afterData: ad, points: p } = (await d.jsonValue()) as { ms: number; at: number; afterData: number; points: number };
      points = p;
      if (i === 0) continue; // the first visit warms the server's route and the browser's cache
      open.push(at);
      draw.push(ms);
      afterData.push(ad);
    }
    const queue: number[] = [];
    for (let i = 0; i < ROUNDS + 1; i++) {
      const started = performance.now();
      await page.goto(`${app.baseUrl}/sites/${seeded.siteId}/surveys/${seeded.surveyId}/review`);
      await page.getByTestId('review-progress').filter({ hasText: /of \d+ reviewed/ }).waitFor({ timeout: 60_000 });
      if (i > 0) queue.push(performance.now() - started);
    }
    await context.close();
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    console.log(`long test: series ${seriesBytes} bytes (${points} points for ${seeded.longSamples} samples) fetched in ${seriesMs.toFixed(0)} ms; open → drawn ${open.map((x) => x.toFixed(0)).join(', ')} ms; uPlot construction ${draw.map((x) => x.toFixed(1)).join(', ')} ms; series response end → painted ${afterData.map((x) => x.toFixed(0)).join(', ')} ms; queue ${queue.map((x) => x.toFixed(0)).join(', ')} ms`);
    return [
      { bench: BENCH, name: 'open test → chart drawn (median)', value: median(open), unit: 'ms', lowerIsBetter: true },
      { bench: BENCH, name: 'chart drawn after data arrived (median)', value: median(afterData), unit: 'ms', target: { op: '<=', value: 100 }, lowerIsBetter: true },
      { bench: BENCH, name: 'uPlot construction (onDrawn ms)', value: median(draw), unit: 'ms', lowerIsBetter: true },
      { bench: BENCH, name: `decimated series of ${(seeded.longSamples / 1e6).toFixed(1)} M samples`, value: seriesBytes, unit: 'bytes', lowerIsBetter: true },
      { bench: BENCH, name: 'series request (one fetch)', value: seriesMs, unit: 'ms', lowerIsBetter: true },
      { bench: BENCH, name: `queue page of ${traps} traps (median)`, value: median(queue), unit: 'ms', lowerIsBetter: true },
    ];
  } finally {
    await app.stop();
    fs.rmSync(userDataDir, { recursive: true, force: true });
    data.remove();
  }
}

if (isMain(module)) {
  runReview({ small: process.argv.includes('--small') })
    .then((f) => report(f, 'Review benchmark'))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}

/**
 * API under load (issue 7 "Benchmarks"): a throwaway database with 20,000 traps and 200,000 tests
 * (scripts/bench/seed-api-worker.ts), the built app served on 127.0.0.1, and autocannon driving
 * each list with 20 connections for 20 s, signed in as the demo analyst: the register list, the
 * test list, the survey summary and the review queue. Prints p50/p99 latency and requests/s;
 * target p99 < 150 ms on 2 cores. Bounded in time, loopback only.
 *
 * Each endpoint is driven for a few seconds first and that run is not counted: the figures are
 * those of a warm server, not of V8 compiling the route. These lists are kept between requests
 * while their data stands (lib/http/kept-replies.ts), so one more run asks the register for a
 * new search on every request, which nothing kept can answer: the cost of a list made afresh.
 *
 *   npm run bench:api [-- --small]   (--small: 2,000 traps, 20,000 tests, 5 s per endpoint)
 */
import autocannon from 'autocannon';
import { DEMO_PASSWORDS, DEMO_USERS } from '../seeders/demo-scenario';
import { isMain, report, runWorker, serveApp, signInCookie, throwawayData, type Figure } from './bench/common';

const BENCH = 'api';

const WARM_UP_SECONDS = 3;

function cannon(url: string, cookie: string, seconds: number, requests?: autocannon.Options['requests']): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon({ url, connections: 20, duration: seconds, headers: { cookie }, requests }, (err, result) => (err ? reject(err) : resolve(result)));
  });
}

/** A register search no earlier request of the run made (four digits: a dozen of the seeder's tags contain each). */
function newSearchEachTime(siteId: number): autocannon.Options['requests'] {
  let n = 0;
  return [{ setupRequest: (req) => ({ ...req, path: `/api/sites/${siteId}/traps?q=${String(n++ % 10_000).padStart(4, '0')}` }) }];
}

export async function runApi(opts: { small?: boolean } = {}): Promise<Figure[]> {
  const traps = opts.small ? 2000 : 20_000;
  const tests = opts.small ? 20_000 : 200_000;
  const seconds = opts.small ? 5 : 20;
  const data = throwawayData('api');
  const t0 = performance.now();
  const seeded = runWorker<{ siteId: number; surveyId: number; traps: number; tests: number; insertSeconds: number }>('seed-api-worker.ts', [String(traps), String(tests)], data.env);
  console.log(`seeded in ${((performance.now() - t0) / 1000).toFixed(1)} s (bulk inserts ${seeded.insertSeconds.toFixed(1)} s): site ${seeded.siteId} with ${seeded.traps} traps, survey ${seeded.surveyId} with ${seeded.tests} tests`);
  const app = await serveApp(data.env);
  const figures: Figure[] = [];
  try {
    const cookie = await signInCookie(app.baseUrl, DEMO_USERS.find((u) => u.role === 'analyst')!.email, DEMO_PASSWORDS.analyst);
    const endpoints: [string, string, autocannon.Options['requests']?][] = [
      ['register list', `/api/sites/${seeded.siteId}/traps`],
      ['test list', `/api/sites/${seeded.siteId}/tests?surveyId=${seeded.surveyId}`],
      ['survey summary', `/api/surveys/${seeded.surveyId}/summary`],
      ['review queue', `/api/surveys/${seeded.surveyId}/review-queue`],
      ['register, new search each request', `/api/sites/${seeded.siteId}/traps?q=000`, newSearchEachTime(seeded.siteId)],
    ];
    for (const [name, path, requests] of endpoints) {
      const target = requests ? undefined : { op: '<' as const, value: 150 };
      // One request first: it must answer 200 (a benchmark of error pages measures nothing), and it warms the route.
      const p0 = performance.now();
      const probe = await fetch(app.baseUrl + path, { headers: { cookie } });
      const body = await probe.text();
      const probeMs = performance.now() - p0;
      if (!probe.ok) throw new Error(`${name} ${path} answered ${probe.status}: ${body.slice(0, 300)}`);
      await cannon(app.baseUrl + path, cookie, Math.min(WARM_UP_SECONDS, seconds), requests);
      const r = await cannon(app.baseUrl + path, cookie, seconds, requests);
      const bad = r.non2xx + r.errors + r.timeouts;
      figures.push({ bench: BENCH, name: `${name} one request alone`, value: probeMs, unit: 'ms', lowerIsBetter: true });
      if (r.requests.total === 0) {
        // Nothing answered within the run: the latency is at least the run's length.
        console.log(`${name.padEnd(15)} ${path}: NO request completed within ${seconds} s under 20 connections (one request alone: ${probeMs.toFixed(0)} ms)`);
        figures.push({ bench: BENCH, name: `${name} p99 (none completed; run length)`, value: seconds * 1000, unit: 'ms', target, lowerIsBetter: true });
        continue;
      }
      console.log(`${name.padEnd(15)} ${path}: p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ${r.requests.average.toFixed(1)} req/s, ${r.requests.total} requests, ${(body.length / 1024).toFixed(0)} KiB a reply${bad ? `, ${bad} NOT 2xx/errors/timeouts` : ''}`);
      figures.push(
        { bench: BENCH, name: `${name} p50`, value: r.latency.p50, unit: 'ms', lowerIsBetter: true },
        { bench: BENCH, name: `${name} p99`, value: r.latency.p99, unit: 'ms', target, lowerIsBetter: true },
        { bench: BENCH, name: `${name} requests/s`, value: r.requests.average, unit: 'req/s', lowerIsBetter: false },
      );
      if (bad) figures.push({ bench: BENCH, name: `${name} failed requests`, value: bad, unit: '', target: { op: '<=', value: 0 }, lowerIsBetter: true });
    }
  } finally {
    await app.stop();
    data.remove();
  }
  return figures;
}

if (isMain(module)) {
  runApi({ small: process.argv.includes('--small') })
    .then((f) => report(f, 'API benchmark'))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}

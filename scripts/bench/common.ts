// Shared by the benchmark scripts (npm run bench, bench:import, bench:analysis, bench:review,
// bench:api): figures with their targets, the history file, a throwaway database, the built app
// served on loopback, and signing in over HTTP. Benchmarks print figures; they never fail a build.
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '../..');
export const DIST_DIR = process.env.NEXT_DIST_DIR || '.next-bench';
export const HISTORY = path.join(ROOT, 'bench-results', 'history.jsonl');

export interface Target {
  op: '<=' | '<';
  value: number;
}

export interface Figure {
  bench: string;
  name: string;
  value: number;
  unit: string;
  target?: Target;
  /** Lower is better (times, sizes, RSS); false for throughputs. */
  lowerIsBetter?: boolean;
}

export const met = (f: Figure) => (f.target ? (f.target.op === '<=' ? f.value <= f.target.value : f.value < f.target.value) : null);

export function gitCommit(): string {
  try {
    const sha = execFileSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: ROOT, encoding: 'utf8' }).trim();
    const dirty = execFileSync('git', ['status', '--porcelain', '--untracked-files=no'], { cwd: ROOT, encoding: 'utf8' }).trim() !== '';
    return dirty ? `${sha}+dirty` : sha;
  } catch {
    return 'unknown';
  }
}

interface HistoryLine {
  date: string;
  commit: string;
  bench: string;
  figures: Record<string, { value: number; unit: string }>;
}

function readHistory(): HistoryLine[] {
  if (!fs.existsSync(HISTORY)) return [];
  return fs.readFileSync(HISTORY, 'utf8').split('\n').filter(Boolean).flatMap((l) => {
    try {
      return [JSON.parse(l) as HistoryLine];
    } catch {
      return [];
    }
  });
}

/** The last earlier run of each bench, for the change column. */
function lastRuns(): Map<string, HistoryLine> {
  const m = new Map<string, HistoryLine>();
  for (const h of readHistory()) m.set(h.bench, h);
  return m;
}

const fmt = (v: number) => (Math.abs(v) >= 1000 ? v.toFixed(0) : Math.abs(v) >= 10 ? v.toFixed(1) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toFixed(3));

/** Prints one table (figure, value, target, met, change against the last run), then appends this run to the history. */
export function report(figures: Figure[], title = 'Plumeward benchmarks'): void {
  const last = lastRuns();
  const rows = figures.map((f) => {
    const prev = last.get(f.bench)?.figures[f.name];
    const change = prev && prev.value !== 0 ? `${((100 * (f.value - prev.value)) / Math.abs(prev.value)) >= 0 ? '+' : ''}${((100 * (f.value - prev.value)) / Math.abs(prev.value)).toFixed(1)} %` : prev ? '' : 'first run';
    const m = met(f);
    return [f.bench, f.name, `${fmt(f.value)} ${f.unit}`, f.target ? `${f.target.op} ${f.target.value} ${f.unit}` : '', m === null ? '' : m ? 'met' : 'MISSED', change];
  });
  const head = ['bench', 'figure', 'value', 'target', '', 'vs last run'];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => `| ${r.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  const commit = gitCommit();
  console.log(`\n${title} — ${new Date().toISOString()} — commit ${commit}`);
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const r of rows) console.log(line(r));
  const missed = figures.filter((f) => met(f) === false);
  if (missed.length) console.log(`\nMISSED TARGETS: ${missed.map((f) => `${f.bench} ${f.name} = ${fmt(f.value)} ${f.unit} (target ${f.target!.op} ${f.target!.value})`).join('; ')}`);
  else console.log('\nEvery figure with a target met it.');

  fs.mkdirSync(path.dirname(HISTORY), { recursive: true });
  const date = new Date().toISOString();
  const byBench = new Map<string, Figure[]>();
  for (const f of figures) byBench.set(f.bench, [...(byBench.get(f.bench) ?? []), f]);
  for (const [bench, fs2] of byBench) {
    const entry: HistoryLine = { date, commit, bench, figures: Object.fromEntries(fs2.map((f) => [f.name, { value: f.value, unit: f.unit }])) };
    fs.appendFileSync(HISTORY, `${JSON.stringify(entry)}\n`);
  }
  console.log(`appended to ${path.relative(ROOT, HISTORY)}`);
}

/** Peak resident set size of this process, sampled every 20 ms. */
export function rssSampler() {
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 20);
  return {
    reset: () => (peak = process.memoryUsage().rss),
    peak: () => Math.max(peak, process.memoryUsage().rss),
    stop: () => clearInterval(timer),
  };
}

/** A folder under tmp/ for one throwaway database and its upload store. */
export function throwawayData(label: string) {
  fs.mkdirSync(path.join(ROOT, 'tmp'), { recursive: true });
  const dir = fs.mkdtempSync(path.join(ROOT, 'tmp', `bench-${label}-`));
  return {
    dir,
    env: { PLUMEWARD_DB: path.join(dir, 'plumeward.sqlite'), PLUMEWARD_STORE: path.join(dir, 'uploads'), NEXT_TELEMETRY_DISABLED: '1' },
    remove: () => fs.rmSync(dir, { recursive: true, force: true }),
  };
}

/**
 * Runs a worker script (scripts/bench/*-worker.ts) in its own Node process: it reads the database
 * path from the environment when lib/db is first imported, and its RSS is its own. The worker's
 * last stdout line is its JSON result.
 */
export function runWorker<T>(script: string, args: string[], env: Record<string, string>, opts: { maxOldSpaceMb?: number } = {}): T {
  const node = [...(opts.maxOldSpaceMb ? [`--max-old-space-size=${opts.maxOldSpaceMb}`] : []), '--expose-gc', '--conditions=react-server', '--import', 'tsx'];
  const r = spawnSync(process.execPath, [...node, path.join(ROOT, 'scripts/bench', script), ...args], {
    cwd: ROOT, env: { ...process.env, ...env }, encoding: 'utf8', maxBuffer: 64 << 20, stdio: ['ignore', 'pipe', 'inherit'],
  });
  if (r.status !== 0) throw new Error(`${script} exited with ${r.status}:\n${r.stdout}`);
  const lines = r.stdout.trim().split('\n');
  return JSON.parse(lines[lines.length - 1]) as T;
}

export function ensureBuild(): void {
  if (fs.existsSync(path.join(ROOT, DIST_DIR, 'BUILD_ID'))) return;
  console.log(`No build in ${DIST_DIR}: running next build (about a minute)…`);
  const r = spawnSync(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'build'], {
    cwd: ROOT, env: { ...process.env, NEXT_DIST_DIR: DIST_DIR, NEXT_TELEMETRY_DISABLED: '1' }, stdio: 'inherit',
  });
  if (r.status !== 0) throw new Error('next build failed');
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

/** `next start` of the bench build on a free loopback port, as tests/setup/app-server.ts serves the app tier. */
export async function serveApp(env: Record<string, string>): Promise<{ baseUrl: string; server: ChildProcess; stop: () => Promise<void> }> {
  ensureBuild();
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = '';
  const server = spawn(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'start', '-p', String(port), '-H', '127.0.0.1'], {
    cwd: ROOT,
    env: { ...process.env, ...env, NEXT_DIST_DIR: DIST_DIR, NEXTAUTH_URL: baseUrl, NEXTAUTH_SECRET: 'bench-secret-for-this-run-only', NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' },
  });
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (server.exitCode !== null) throw new Error(`The app exited with ${server.exitCode}:\n${output}`);
    try {
      if ((await fetch(`${baseUrl}/api/openapi.json`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`The app did not answer within 60 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  const stop = () => new Promise<void>((resolve) => {
    if (server.exitCode !== null) return resolve();
    server.once('exit', () => resolve());
    server.kill('SIGTERM');
  });
  return { baseUrl, server, stop };
}

/** Signs in through next-auth's credentials flow (STACK.md pitfall 12); returns the cookie header. */
export async function signInCookie(baseUrl: string, email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
  keep(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST', redirect: 'manual', headers: { cookie: header(), 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  keep(res);
  const session = await (await fetch(`${baseUrl}/api/auth/session`, { headers: { cookie: header() } })).json();
  if (!session?.user) throw new Error(`Could not sign in as ${email}`);
  return header();
}

export const isMain = (m: NodeModule) => require.main === m;

// A second app server with a database of its own, for tests that stop or kill it (the shared
// one of tests/setup/app-server.ts must stay up for the other tests).
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

export const root = path.resolve(__dirname, '../..');

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

export function runDb(command: string, dbPath: string) {
  const result = spawnSync(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/db.ts', command], {
    cwd: root, env: { ...process.env, PLUMEWARD_DB: dbPath }, encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`db ${command} failed:\n${result.stdout}\n${result.stderr}`);
  return result.stdout;
}

export type OwnServer = { baseUrl: string; dbPath: string; process: ChildProcess; log: () => string };

/** The command that serves the built app on a port over a database, and its environment. */
export function nextStart(dbPath: string, port: number) {
  const baseUrl = `http://127.0.0.1:${port}`;
  return {
    baseUrl,
    command: process.execPath,
    args: [path.join(root, 'node_modules/next/dist/bin/next'), 'start', '-p', String(port), '-H', '127.0.0.1'],
    env: { ...process.env, PLUMEWARD_DB: dbPath, NEXTAUTH_URL: baseUrl, NEXTAUTH_SECRET: 'own-server-test-secret', NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' } as NodeJS.ProcessEnv,
  };
}

/** Serves the built app on a free port over the given database; resolves once it answers. */
export async function startServer(dbPath: string, port?: number): Promise<OwnServer> {
  const { baseUrl, command, args, env } = nextStart(dbPath, port ?? (await freePort()));
  return whenAnswering(spawn(command, args, { cwd: root, env }), baseUrl, dbPath);
}

/** Resolves once a just-spawned app server answers at baseUrl; throws with its output if it exits or takes a minute. */
export async function whenAnswering(child: ChildProcess, baseUrl: string, dbPath: string): Promise<OwnServer> {
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited: ${output}`);
    try {
      if ((await fetch(`${baseUrl}/api/openapi.json`)).ok) break;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error(`server did not start: ${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return { baseUrl, dbPath, process: child, log: () => output };
}

export function tempDb(label: string): string {
  fs.mkdirSync(path.join(root, 'tmp'), { recursive: true });
  return path.join(fs.mkdtempSync(path.join(root, 'tmp', `${label}-`)), 'plumeward.sqlite');
}

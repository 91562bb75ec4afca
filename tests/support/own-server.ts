// A second app server with a database of its own, for tests that stop or kill it (the shared
// one of tests/setup/app-server.ts must stay up for the other tests).
//
// Both dialects: a test database is named by a path `<folder>/plumeward.sqlite`. Without
// PLUMEWARD_DATABASE_URL that is the SQLite file. With it (the PostgreSQL leg of .ci/run), the app
// tier's shared database (folder `app-tests-…`) is the database that URL names, and every other
// one, made by tempDb, a database of its own on that server named after its folder. Either way
// the folder holds the upload store and the rest of the test's files, as on SQLite; a test process
// that opens the app's own modules (PLUMEWARD_DB ??= inject('dbPath')) reaches the same data.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import { createRequire } from 'node:module';
import net from 'node:net';
import path from 'node:path';
import sqlite3 from 'sqlite3';

export const root = path.resolve(__dirname, '../..');

/** The PostgreSQL database of the run's app tier, or null for SQLite. */
const pgServer = process.env.PLUMEWARD_DATABASE_URL || null;

/** The folder of the app tier's shared database (tests/setup/app-server.ts); tempDb never makes one. */
export const APP_TIER_FOLDER = 'app-tests-';

/** The PostgreSQL database of a test database path (null on SQLite). */
export function databaseUrlOf(dbPath: string): string | null {
  if (!pgServer) return null;
  const folder = path.basename(path.dirname(dbPath));
  if (folder.startsWith(APP_TIER_FOLDER)) return pgServer;
  const url = new URL(pgServer);
  url.pathname = `/${`${url.pathname.slice(1)}_${folder.toLowerCase().replace(/[^a-z0-9]+/g, '_')}`.slice(0, 63)}`;
  return url.toString();
}

/** What a process needs in its environment to use the test database at `dbPath`. */
export function databaseEnv(dbPath: string): Record<string, string> {
  const url = databaseUrlOf(dbPath);
  return url ? { PLUMEWARD_DB: dbPath, PLUMEWARD_DATABASE_URL: url } : { PLUMEWARD_DB: dbPath };
}

// The app tier's database is emptied in place (its schema dropped and made again: the run's role
// owns it); another test's database is dropped and made again, through the app tier's database.
const EMPTY_DATABASE = `
const { Client } = require('pg');
const [server, name] = process.argv.slice(1);
const client = new Client({ connectionString: server });
const sql = name
  ? ['DROP DATABASE IF EXISTS "' + name + '" WITH (FORCE)', 'CREATE DATABASE "' + name + '"']
  : ['DROP SCHEMA IF EXISTS public CASCADE', 'CREATE SCHEMA public'];
client.connect()
  .then(() => sql.reduce((done, q) => done.then(() => client.query(q)), Promise.resolve()))
  .then(() => client.end(), (err) => { console.error(err.message); process.exit(1); });
`;

/** Empties the test database at `dbPath`: a SQLite file is removed; a PostgreSQL database is made afresh. */
export function freshDatabase(dbPath: string) {
  fs.mkdirSync(path.dirname(dbPath), { recursive: true });
  const url = databaseUrlOf(dbPath);
  if (!url) {
    fs.rmSync(dbPath, { force: true });
    return;
  }
  const own = url === pgServer ? [] : [new URL(url).pathname.slice(1)];
  const result = spawnSync(process.execPath, ['-e', EMPTY_DATABASE, pgServer!, ...own], { cwd: root, encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`Could not empty the PostgreSQL database ${new URL(url).pathname.slice(1)}:\n${result.stderr}`);
}

// pg ships no typings of its own; these are the few calls made here.
type PgTypes = { getTypeParser(oid: number, format?: string): (value: string) => unknown };
type PgClient = { connect(): Promise<void>; query(sql: string, params: unknown[]): Promise<{ rows: unknown[] }>; end(): Promise<void> };
type PgModule = { Client: new (config: { connectionString: string; types: PgTypes }) => PgClient; types: PgTypes };
const INT8 = 20;

/**
 * One SQL statement on the test database at `dbPath`, with `?` placeholders, as the tests read
 * (and now and then adjust) what the app stored. Counts come back as numbers on both dialects.
 */
export async function queryDb<T>(dbPath: string, sql: string, params: unknown[] = []): Promise<T[]> {
  const url = databaseUrlOf(dbPath);
  if (url) {
    const pg = createRequire(__filename)('pg') as PgModule;
    const types: PgTypes = { getTypeParser: (oid, format) => (oid === INT8 ? Number : pg.types.getTypeParser(oid, format)) };
    const client = new pg.Client({ connectionString: url, types });
    await client.connect();
    try {
      let n = 0;
      return (await client.query(sql.replace(/\?/g, () => `$${++n}`), params)).rows as T[];
    } finally {
      await client.end();
    }
  }
  const db = await new Promise<sqlite3.Database>((resolve, reject) => {
    const opened: sqlite3.Database = new sqlite3.Database(dbPath, sqlite3.OPEN_READWRITE, (err) => (err ? reject(err) : resolve(opened)));
  });
  const all = (q: string, p: unknown[]) => new Promise<T[]>((resolve, reject) => db.all(q, p, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
  try {
    await all('PRAGMA busy_timeout=10000', []);
    return await all(sql, params);
  } finally {
    await new Promise<void>((resolve) => db.close(() => resolve()));
  }
}

/** The tables of the test database, by name. */
export async function tableNames(dbPath: string): Promise<string[]> {
  const rows = databaseUrlOf(dbPath)
    ? await queryDb<{ name: string }>(dbPath, "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE'")
    : await queryDb<{ name: string }>(dbPath, "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'");
  return rows.map((r) => r.name).sort();
}

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
    cwd: root, env: { ...process.env, ...databaseEnv(dbPath) }, encoding: 'utf8',
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
    env: { ...process.env, ...databaseEnv(dbPath), NEXTAUTH_URL: baseUrl, NEXTAUTH_SECRET: 'own-server-test-secret', NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' } as NodeJS.ProcessEnv,
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

/** A new, empty test database (a SQLite file in a folder of its own under tmp/, or its PostgreSQL twin). */
export function tempDb(label: string): string {
  if (`${label}-`.startsWith(APP_TIER_FOLDER)) throw new Error(`${label}: that folder name is the app tier's`);
  fs.mkdirSync(path.join(root, 'tmp'), { recursive: true });
  const dbPath = path.join(fs.mkdtempSync(path.join(root, 'tmp', `${label}-`)), 'plumeward.sqlite');
  freshDatabase(dbPath);
  return dbPath;
}

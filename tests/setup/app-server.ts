// Global setup of the app tier: a fresh SQLite file with the real migrations and the demo seed,
// and the built app (`next build` has run) served on a free loopback port. Tests reach it over HTTP.
// With PLUMEWARD_DATABASE_URL set (the PostgreSQL leg of .ci/run) the database is instead the one
// that URL names, emptied (schema dropped and made again), then migrated and seeded the same way.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { APP_TIER_FOLDER, databaseEnv, databaseUrlOf, freePort, freshDatabase, runDb } from '../support/own-server';
import { startMailCatcher } from '../../lib/mail/catcher';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    dbPath: string;
    mailboxPath: string;
  }
}

const root = path.resolve(__dirname, '../..');

async function waitUntilUp(url: string, server: ChildProcess, log: () => string) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`The app exited with ${server.exitCode}:\n${log()}`);
    try {
      if ((await fetch(`${url}/api/openapi.json`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The app did not answer within 60 s:\n${log()}`);
}

export default async function setup(project: TestProject) {
  if (!fs.existsSync(path.join(root, process.env.NEXT_DIST_DIR || '.next', 'BUILD_ID'))) {
    throw new Error('No production build: run `npm run build` first (npm test does).');
  }
  fs.mkdirSync(path.join(root, 'tmp'), { recursive: true });
  const dir = fs.mkdtempSync(path.join(root, 'tmp', APP_TIER_FOLDER));
  const dbPath = path.join(dir, 'plumeward.sqlite');
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // Real SMTP over loopback: the app sends to this catcher, which keeps each message for the mailbox.
  const mailboxPath = path.join(dir, 'mailbox.jsonl');
  const catcher = await startMailCatcher({ file: mailboxPath });
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    ...databaseEnv(dbPath),
    NEXTAUTH_URL: baseUrl,
    NEXTAUTH_SECRET: 'test-secret-for-this-run-only',
    NEXT_TELEMETRY_DISABLED: '1',
    NODE_ENV: 'production',
    // Small limits, so the tests can reach them without sending gigabytes.
    PLUMEWARD_MAX_FILE_MB: '8',
    PLUMEWARD_MAX_FILES: '60',
    PLUMEWARD_MAX_UPLOAD_MB: '40',
    SMTP_URL: `smtp://127.0.0.1:${catcher.port}`,
    MAIL_FROM: 'Plumeward tests <no-reply@plumeward.example>',
    PLUMEWARD_MAILBOX: mailboxPath,
  };
  freshDatabase(dbPath);
  console.log(`App tier on ${databaseUrlOf(dbPath)?.replace(/\/\/[^@]*@/, '//') ?? dbPath}`);
  runDb('migrate', dbPath);
  runDb('seed', dbPath);

  let output = '';
  const server = spawn(process.execPath, [path.join(root, 'node_modules/next/dist/bin/next'), 'start', '-p', String(port), '-H', '127.0.0.1'], { cwd: root, env });
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  await waitUntilUp(baseUrl, server, () => output);

  project.provide('baseUrl', baseUrl);
  project.provide('dbPath', dbPath);
  project.provide('mailboxPath', mailboxPath);

  return async () => {
    server.kill('SIGTERM');
    await catcher.close();
    fs.writeFileSync(path.join(dir, 'server.log'), output);
  };
}

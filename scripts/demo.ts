// The embedded demo: migrate and seed a local SQLite file, build the app, and serve it.
//   npm ci && npm run demo        (PORT=3000 by default; PLUMEWARD_DB to use another file)
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { databasePath, sequelize } from '@/lib/db';
import { startMailCatcher } from '@/lib/mail/catcher';
import { mailboxPath } from '@/lib/mail/config';
import { migrator, seeder } from '@/lib/migrator';
import { writeDemoDayFiles } from '@/seeders/demo-meter-files';
import { DEMO_ANALYST_TOKEN, DEMO_PASSWORDS, DEMO_USERS } from '@/seeders/demo-scenario';

const root = path.resolve(__dirname, '..');
const port = Number(process.env.PORT ?? 3000);
const url = process.env.NEXTAUTH_URL ?? `http://localhost:${port}`;
const next = path.join(root, 'node_modules/next/dist/bin/next');
const env = { ...process.env, NEXTAUTH_URL: url, NEXT_TELEMETRY_DISABLED: '1' };

function step(title: string) {
  console.log(`\n▸ ${title}`);
}

async function prepareDatabase() {
  step(`Database ${databasePath()}`);
  const migrated = await migrator(sequelize).up();
  console.log(`  ${migrated.length} migration(s) applied`);
  const seeded = await seeder(sequelize).up();
  console.log(seeded.length ? `  demo scenario seeded (${seeded.map((s) => s.name).join(', ')})` : '  demo scenario already present');
  // The rest of today's route, as the meters would export it: files to try uploading.
  const dayDir = path.join(path.dirname(databasePath()), 'sample-meter-files', 'demo-day');
  await writeDemoDayFiles(dayDir);
  console.log(`  meter files of the traps not yet tested in the survey in progress: ${dayDir}`);
  await sequelize.close();
}

function copySampleFiles() {
  const from = path.join(root, 'fixtures', 'meters');
  const to = path.join(path.dirname(databasePath()), 'sample-meter-files');
  if (!fs.existsSync(from)) return;
  fs.cpSync(from, to, { recursive: true, filter: (src) => !src.endsWith('.ts') && !src.endsWith('.expected.json') });
  step(`Sample meter files to try uploading: ${to}`);
}

function build() {
  step('Building the app (about a minute)');
  const result = spawnSync(process.execPath, [next, 'build'], { cwd: root, env, stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

// Mail goes to a local SMTP catcher, shown on Settings → Development mailbox, unless SMTP_URL
// names a real server.
async function startMail() {
  if (process.env.SMTP_URL) {
    step(`E-mail goes to ${process.env.SMTP_URL.replace(/\/\/[^@/]*@/, '//…@')}`);
    return;
  }
  const catcher = await startMailCatcher({ port: Number(process.env.MAIL_CATCHER_PORT ?? 2525), file: mailboxPath() });
  Object.assign(env, { SMTP_URL: `smtp://127.0.0.1:${catcher.port}`, PLUMEWARD_MAILBOX: catcher.file });
  step(`Mail catcher on smtp://127.0.0.1:${catcher.port} (messages kept in ${catcher.file}; Settings → Development mailbox)`);
}

function serve() {
  const server = spawn(process.execPath, [next, 'start', '-p', String(port)], { cwd: root, env, stdio: 'inherit' });
  step(`Plumeward is at ${url}`);
  console.log('  Demo accounts (demo only; change them before real use):');
  for (const u of DEMO_USERS) console.log(`    ${u.role.padEnd(11)} ${u.email.padEnd(30)} ${DEMO_PASSWORDS[u.role]}`);
  console.log(`  API token of the demo analyst: ${DEMO_ANALYST_TOKEN}`);
  console.log('  Stop with Ctrl+C.\n');
  const stop = () => server.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  server.on('exit', (code) => process.exit(code ?? 0));
}

prepareDatabase()
  .then(() => {
    copySampleFiles();
    build();
    return startMail();
  })
  .then(() => serve())
  .catch((err) => {
    console.error(err);
    process.exit(1);
  });

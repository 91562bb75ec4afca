// Online backup and restore of a Plumeward installation: the SQLite database copied with SQLite's
// own backup API (a consistent snapshot while the app keeps running; WAL readers and writers are
// not blocked for long) and the upload store copied file by file, with a manifest of row counts
// and SHA-256s so a restore can prove it is whole. Used by scripts/db-backup.ts and db-restore.ts.
// SQLite only: an installation on PostgreSQL (PLUMEWARD_DATABASE_URL) is backed up with that
// server's own tools, and createBackup says so instead of copying a SQLite file nobody uses.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { databaseLabel, databaseUrl } from '@/lib/db';

export interface BackupManifest {
  format: 'plumeward.backup';
  version: 1;
  createdAt: string;
  source: { database: string; store: string };
  database: string;
  store: string;
  tables: Record<string, number>;
  files: { path: string; size: number; sha256: string }[];
}

// sqlite3's Backup object has no typings of its own (node_modules/sqlite3/lib/sqlite3.js, Database#backup).
interface SqliteBackup {
  step(pages: number, callback: (err: Error | null) => void): void;
  finish(callback?: (err: Error | null) => void): void;
  completed: boolean;
  failed: boolean;
  remaining: number;
  pageCount: number;
}

function open(file: string, mode: number): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, mode, (err) => (err ? reject(err) : resolve(db)));
  });
}
const all = <T>(db: sqlite3.Database, sql: string) => new Promise<T[]>((resolve, reject) => db.all(sql, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
const run = (db: sqlite3.Database, sql: string) => new Promise<void>((resolve, reject) => db.exec(sql, (err) => (err ? reject(err) : resolve())));
const close = (db: sqlite3.Database) => new Promise<void>((resolve, reject) => db.close((err) => (err ? reject(err) : resolve())));

/** Row count of every table (migrations' bookkeeping included), in name order. */
export async function tableCounts(file: string): Promise<Record<string, number>> {
  const db = await open(file, sqlite3.OPEN_READONLY);
  try {
    const tables = await all<{ name: string }>(db, "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name");
    const counts: Record<string, number> = {};
    for (const { name } of tables) counts[name] = (await all<{ n: number }>(db, `SELECT COUNT(*) AS n FROM "${name.replace(/"/g, '""')}"`))[0].n;
    return counts;
  } finally {
    await close(db);
  }
}

/** SQLite's online backup of `source` into the new file `target`, 256 pages a step so writers get turns between steps. */
export async function backupDatabase(source: string, target: string): Promise<void> {
  if (!fs.existsSync(source)) throw new Error(`No database at ${source} (set PLUMEWARD_DB to the live database file).`);
  const db = await open(source, sqlite3.OPEN_READWRITE);
  try {
    await run(db, 'PRAGMA busy_timeout=10000;');
    const backup = (db as unknown as { backup(file: string): SqliteBackup }).backup(target);
    await new Promise<void>((resolve, reject) => {
      const step = () => backup.step(256, (err) => {
        if (err) return backup.finish(() => reject(err));
        if (backup.completed) return backup.finish((e) => (e ? reject(e) : resolve()));
        if (backup.failed) return backup.finish(() => reject(new Error('the SQLite backup failed')));
        setImmediate(step);
      });
      step();
    });
  } finally {
    await close(db);
  }
  // The copy is a plain database file: no WAL beside it, so it can be moved or restored as one file.
  const copy = await open(target, sqlite3.OPEN_READWRITE);
  try {
    await run(copy, 'PRAGMA journal_mode=DELETE;');
    const check = await all<{ integrity_check: string }>(copy, 'PRAGMA integrity_check');
    if (check[0]?.integrity_check !== 'ok') throw new Error(`The backup copy fails SQLite's integrity check: ${JSON.stringify(check)}`);
  } finally {
    await close(copy);
  }
}

export function sha256File(file: string): string {
  return createHash('sha256').update(fs.readFileSync(file)).digest('hex');
}

/** Every kept file of an upload store, relative to its root (parts still streaming in `incoming/` are not kept uploads). */
export function storeFiles(root: string): string[] {
  if (!fs.existsSync(root)) return [];
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      const rel = path.relative(root, full);
      if (e.isDirectory()) {
        if (rel !== 'incoming') walk(full);
      } else if (e.isFile()) out.push(rel);
    }
  };
  walk(root);
  return out.sort();
}

function copyFiles(fromRoot: string, toRoot: string, files: string[]) {
  for (const rel of files) {
    const to = path.join(toRoot, rel);
    fs.mkdirSync(path.dirname(to), { recursive: true });
    fs.copyFileSync(path.join(fromRoot, rel), to);
    fs.chmodSync(to, 0o440);
  }
}

export const stamp = (d = new Date()) => d.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);

/** Backs up the database and the upload store into `folder` (created; must not exist yet). */
export async function createBackup(opts: { database: string; store: string; folder: string }): Promise<BackupManifest> {
  if (databaseUrl()) {
    throw new Error(`db:backup copies a SQLite database with SQLite's backup API, and this installation uses PostgreSQL (${databaseLabel()}, from PLUMEWARD_DATABASE_URL). `
      + 'Back up the database with pg_dump (pg_dump --format=custom --file=plumeward.dump "$PLUMEWARD_DATABASE_URL"; restore with pg_restore into an empty database) '
      + `and copy the upload store (${opts.store}) beside the dump.`);
  }
  if (fs.existsSync(opts.folder)) throw new Error(`${opts.folder} exists already: a backup goes into a new folder.`);
  fs.mkdirSync(opts.folder, { recursive: true });
  const dbCopy = path.join(opts.folder, 'plumeward.sqlite');
  // The database first: a file stored after this moment belongs to rows the copy does not have, which is harmless;
  // the other order could leave rows naming files the backup lacks.
  await backupDatabase(opts.database, dbCopy);
  const files = storeFiles(opts.store);
  copyFiles(opts.store, path.join(opts.folder, 'uploads'), files);
  const manifest: BackupManifest = {
    format: 'plumeward.backup', version: 1, createdAt: new Date().toISOString(),
    source: { database: path.resolve(opts.database), store: path.resolve(opts.store) },
    database: 'plumeward.sqlite', store: 'uploads',
    tables: await tableCounts(dbCopy),
    files: files.map((rel) => ({ path: rel, size: fs.statSync(path.join(opts.folder, 'uploads', rel)).size, sha256: sha256File(path.join(opts.folder, 'uploads', rel)) })),
  };
  fs.writeFileSync(path.join(opts.folder, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  return manifest;
}

/** Restores a backup folder into `target` (new or empty), checking every count and hash against the manifest. */
export async function restoreBackup(folder: string, target: string): Promise<{ database: string; store: string; manifest: BackupManifest }> {
  const manifestPath = path.join(folder, 'manifest.json');
  if (!fs.existsSync(manifestPath)) throw new Error(`${folder} is not a Plumeward backup (no manifest.json).`);
  const manifest = JSON.parse(fs.readFileSync(manifestPath, 'utf8')) as BackupManifest;
  if (manifest.format !== 'plumeward.backup') throw new Error(`${manifestPath} is not a Plumeward backup manifest.`);
  if (fs.existsSync(target) && fs.readdirSync(target).length > 0) throw new Error(`${target} is not empty: restore into a fresh directory.`);
  fs.mkdirSync(target, { recursive: true });
  const database = path.join(target, 'plumeward.sqlite');
  const store = path.join(target, 'uploads');
  fs.copyFileSync(path.join(folder, manifest.database), database);
  copyFiles(path.join(folder, manifest.store), store, manifest.files.map((f) => f.path));
  const counts = await tableCounts(database);
  for (const [table, n] of Object.entries(manifest.tables)) {
    if (counts[table] !== n) throw new Error(`Restored table ${table} has ${counts[table]} rows; the backup had ${n}.`);
  }
  for (const f of manifest.files) {
    const sha = sha256File(path.join(store, f.path));
    if (sha !== f.sha256) throw new Error(`Restored file ${f.path} does not match its SHA-256 in the manifest.`);
  }
  return { database, store, manifest };
}

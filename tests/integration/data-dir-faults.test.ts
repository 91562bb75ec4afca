// The upload store on a disk that fills up mid-file, or that turns read-only: the upload is
// refused with a status and message saying so, nothing of it stays on disk or in the database,
// and the same upload goes through once the disk is fixed. The database on a disk that fills:
// the write is refused (507), or the file being imported is rolled back, and the database stays
// sound. Each disk is a real tmpfs in the server's own mount namespace
// (tests/support/confined-server.ts), not a mocked file system.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { kibOnTmpfs, startConfinedServer, type ConfinedServer } from '../support/confined-server';
import { Client, DEMO, signedIn } from '../support/http';
import { root, runDb, tempDb } from '../support/own-server';
import { modelAFileFor, settled, upload, type FilePart } from '../support/uploads';
import { photoForm, TINY_PNG } from './samples/field-notes';

const STORE_FULL = "The server's upload store is full: its disk has no space left, so nothing of this upload was stored. "
  + "Free space on the store's disk (or ask your administrator to), then send the files again.";
const STORE_UNWRITABLE = 'The server cannot write to its upload store (its data directory is read-only or not writable), so nothing of this upload was stored. '
  + 'Your administrator must make the store writable; then send the files again.';

function query<T>(dbPath: string, sql: string): Promise<T[]> {
  const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
  return new Promise((resolve, reject) => db.all(sql, (err, rows) => { db.close(); return err ? reject(err) : resolve(rows as T[]); }));
}

/** Every table's rows, hashed: two equal snapshots mean the database was not changed. */
async function snapshot(dbPath: string): Promise<Record<string, { rows: number; sha256: string }>> {
  const tables = await query<{ name: string }>(dbPath, "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name");
  const out: Record<string, { rows: number; sha256: string }> = {};
  for (const { name } of tables) {
    const rows = await query(dbPath, `SELECT * FROM "${name}" ORDER BY rowid`);
    out[name] = { rows: rows.length, sha256: createHash('sha256').update(JSON.stringify(rows)).digest('hex') };
  }
  return out;
}

/** A model A test of `rows` readings at 10 Hz: long enough that its stored series is `rows` × 8 bytes. */
function longModelAFile(tag: string, rows: number): FilePart {
  const [head, ...lines] = (modelAFileFor(tag).bytes as string).replace(/^\uFEFF/, '').trim().split('\n');
  const t0 = Date.parse('2025-04-08T09:20:10.000Z');
  const out = [`\uFEFF${head}`];
  for (let i = 0; i < rows; i++) {
    const [, , level, temperature] = lines[i % lines.length].split(',');
    out.push(`${new Date(t0 + i * 100).toISOString()},${tag},${level},${temperature}`);
  }
  return { name: `A_${tag}_long.csv`, bytes: `${out.join('\n')}\n` };
}

const sha256Of = (f: FilePart) => createHash('sha256').update(f.bytes).digest('hex');
const storedAs = (f: FilePart) => { const h = sha256Of(f); return `${h.slice(0, 2)}/${h}`; };

describe('an upload store that is full or read-only', () => {
  let server: ConfinedServer;
  let dbPath: string;
  let store: string; // a tmpfs of its own, as the server sees it
  let analyst: Client;
  let surveyId: number;
  let tags: string[];

  beforeAll(async () => {
    dbPath = tempDb('data-dir-faults');
    runDb('migrate', dbPath);
    runDb('seed', dbPath);
    store = path.join(path.dirname(dbPath), 'store-disk');
    fs.mkdirSync(store);
    // The seeded store is copied onto a disk with 2 MB to spare, so the server's store is complete.
    const seeded = path.join(path.dirname(dbPath), 'uploads');
    server = await startConfinedServer(dbPath, [{ dir: store, sizeKb: kibOnTmpfs(seeded) + 2048, copyFrom: `${seeded}/.` }], { PLUMEWARD_STORE: store });
    analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    const site = (await analyst.get('/api/sites')).body.items.find((s: { code: string }) => s.code === 'FV');
    surveyId = (await analyst.post(`/api/sites/${site.id}/surveys`, { name: 'Disk faults', startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    tags = (await analyst.get(`/api/sites/${site.id}/traps?status=in_service&pageSize=10`)).body.items.map((t: { tag: string }) => t.tag);
  });
  afterEach(() => {
    server?.remount(store, 'rw');
  });
  afterAll(async () => {
    await server?.stop();
  });

  it('refuses an upload with 503 while the store is read-only, changing nothing, and takes it once writable', async () => {
    const files = [modelAFileFor(tags[0])];
    const dbBefore = await snapshot(dbPath);
    const storeBefore = server.files(store);
    expect(storeBefore.size, 'the seeded store was copied').toBeGreaterThan(0);

    server.remount(store, 'ro');
    const refused = await upload(analyst, surveyId, files);
    expect(refused.status).toBe(503);
    expect(refused.body.error).toEqual({ code: 'storage_unwritable', message: STORE_UNWRITABLE });
    // Also when the folder for incoming parts is missing and cannot be made.
    server.remount(store, 'rw');
    server.inside('rm', '-r', path.join(store, 'incoming'));
    const withoutIncoming = new Map([...storeBefore].filter(([name]) => !name.startsWith('incoming/')));
    server.remount(store, 'ro');
    const again = await upload(analyst, surveyId, files);
    expect(again.status).toBe(503);
    expect(again.body.error).toEqual({ code: 'storage_unwritable', message: STORE_UNWRITABLE });
    expect(await snapshot(dbPath)).toEqual(dbBefore);
    expect(server.files(store)).toEqual(withoutIncoming);

    server.remount(store, 'rw');
    const sent = await upload(analyst, surveyId, files);
    expect(sent.status).toBe(201);
    const done = await settled(analyst, sent.body.id);
    expect(done.status).toBe('done');
    expect(done.progress.tests).toBe(1);
    expect(server.files(store).get(storedAs(files[0]))).toEqual({ size: Buffer.byteLength(files[0].bytes), sha256: sha256Of(files[0]) });
  });

  it('refuses an upload with 507 when the disk fills mid-file, keeps no part of it, and takes the same upload once space is freed', async () => {
    const files = [modelAFileFor(tags[1]), modelAFileFor(tags[2])];
    const sizes = files.map((f) => Buffer.byteLength(f.bytes));
    const { free, block } = server.space(store);
    // Room for the first file and one block of the second: the disk fills while the second streams in.
    const room = (Math.ceil(sizes[0] / block) + 1) * block;
    expect(sizes[1]).toBeGreaterThan(block);
    const filler = path.join(store, 'filler');
    server.inside('fallocate', '-l', String(free - room), filler);
    expect(server.space(store).free).toBe(room);
    const dbBefore = await snapshot(dbPath);
    const storeBefore = server.files(store);

    // A large file runs out of room while the request is still arriving; the rest of it is read
    // and dropped so the client gets the answer.
    const large = longModelAFile(tags[3], 30_000);
    expect(Buffer.byteLength(large.bytes)).toBeGreaterThan(1024 * 1024);
    const tooLarge = await upload(analyst, surveyId, [large]);
    expect(tooLarge.status).toBe(507);
    expect(tooLarge.body.error).toEqual({ code: 'storage_full', message: STORE_FULL });
    expect(server.files(store)).toEqual(storeBefore);
    expect(server.space(store).free).toBe(room);
    // Two small files: the second fills the disk as it is written, with little or nothing of the request left to arrive.
    const refused = await upload(analyst, surveyId, files);
    expect(refused.status).toBe(507);
    expect(refused.body.error).toEqual({ code: 'storage_full', message: STORE_FULL });
    expect(server.files(store)).toEqual(storeBefore);
    expect([...server.files(store).keys()].filter((f) => f.startsWith('incoming/'))).toEqual([]);
    expect(server.space(store).free, 'the partial files were removed').toBe(room);
    expect(await snapshot(dbPath)).toEqual(dbBefore);

    server.inside('rm', filler);
    const sent = await upload(analyst, surveyId, files);
    expect(sent.status).toBe(201);
    const done = await settled(analyst, sent.body.id);
    expect(done.status).toBe('done');
    expect(done.files.map((f: { name: string; status: string; testCount: number }) => [f.name, f.status, f.testCount]))
      .toEqual(files.map((f) => [f.name, 'processed', 1]));
    const stored = server.files(store);
    for (const [i, f] of files.entries()) expect(stored.get(storedAs(f))).toEqual({ size: sizes[i], sha256: sha256Of(f) });
  });

  it('refuses a field-note photo with 507 when the store fills while it streams in, and keeps nothing of it', async () => {
    const trap = (await analyst.get(`/api/sites/${(await analyst.get('/api/sites')).body.items.find((s: { code: string }) => s.code === 'FV').id}/traps?status=in_service&pageSize=1`)).body.items[0];
    // A PNG's signature and then 400 KB: judged a photo by its first bytes, larger than the room left.
    const photo = Buffer.concat([TINY_PNG, Buffer.alloc(400 * 1024, 7)]);
    const { free, block } = server.space(store);
    const filler = path.join(store, 'filler');
    server.inside('fallocate', '-l', String(free - 4 * block), filler);
    const dbBefore = await snapshot(dbPath);
    const storeBefore = server.files(store);
    try {
      const refused = await analyst.request('POST', `/api/surveys/${surveyId}/traps/${trap.id}/field-notes/photo`, photoForm(photo, 'outlet.png'));
      expect(refused.status).toBe(507);
      expect(refused.body.error).toEqual({ code: 'storage_full', message: STORE_FULL });
      expect(server.files(store)).toEqual(storeBefore);
      expect(await snapshot(dbPath)).toEqual(dbBefore);
    } finally {
      server.inside('rm', filler);
    }
    const kept = await analyst.request('POST', `/api/surveys/${surveyId}/traps/${trap.id}/field-notes/photo`, photoForm(photo, 'outlet.png'));
    expect(kept.status).toBe(201);
  });
});

const READ_SQL = `const [sqlite3, file, sql] = process.argv.slice(1);
const db = new (require(sqlite3).Database)(file, require(sqlite3).OPEN_READONLY, (err) => { if (err) throw err; });
db.all(sql, (err, rows) => { if (err) throw err; process.stdout.write(JSON.stringify(rows)); db.close(); });`;

const IMPORT_STOPPED_FULL = "The import stopped because the server's disk is full: the files not yet read were not imported (nothing of them was kept). "
  + 'Free space on the data disk, then send them again.';

const DATABASE_FULL = "The server's database is full: its disk has no space left, so this change was not saved. "
  + 'Free space on the data disk (or ask your administrator to), then try again.';

describe('a database whose disk fills up', () => {
  let server: ConfinedServer;
  let dbDisk: string; // a tmpfs holding the database, as the server sees it
  let live: string; // the database file on it
  let analyst: Client;
  let siteId: number;
  let surveyId: number;
  let tag: string;
  const filler = () => path.join(dbDisk, 'filler');
  /** Fills the database's disk until `room` bytes are left. */
  const leave = (room: number) => {
    server.inside('fallocate', '-l', String(server.space(dbDisk).free - room), filler());
    expect(server.space(dbDisk).free).toBe(room);
  };
  // Read where the server sees the file: SQLite resolves /proc/<pid>/root back to the host's path.
  const db = (sql: string): unknown[] => JSON.parse(server.inside(process.execPath, '-e', READ_SQL, path.join(root, 'node_modules/sqlite3'), live, sql));

  beforeAll(async () => {
    const seeded = tempDb('db-full');
    runDb('migrate', seeded);
    runDb('seed', seeded);
    dbDisk = path.join(path.dirname(seeded), 'db-disk');
    live = path.join(dbDisk, 'plumeward.sqlite');
    fs.mkdirSync(dbDisk);
    server = await startConfinedServer(live, [{ dir: dbDisk, sizeKb: Math.ceil(fs.statSync(seeded).size / 1024) + 16 * 1024, copyFrom: seeded }],
      { PLUMEWARD_STORE: path.join(path.dirname(seeded), 'uploads') });
    analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    siteId = (await analyst.get('/api/sites')).body.items.find((s: { code: string }) => s.code === 'FV').id;
    surveyId = (await analyst.post(`/api/sites/${siteId}/surveys`, { name: 'Database disk', startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    tag = (await analyst.get(`/api/sites/${siteId}/traps?status=in_service&pageSize=1`)).body.items[0].tag;
  });
  afterEach(() => {
    server?.inside('rm', '-f', filler());
  });
  afterAll(async () => {
    await server?.stop();
  });

  it('answers a write with 507 when the database cannot grow, saves nothing of it, and stays sound', async () => {
    const before = db('SELECT COUNT(*) AS n FROM surveys');
    leave(0);
    const refused = await analyst.post(`/api/sites/${siteId}/surveys`, { name: 'No room', startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' });
    expect(refused.status).toBe(507);
    expect(refused.body.error).toEqual({ code: 'storage_full', message: DATABASE_FULL });
    expect(db('SELECT COUNT(*) AS n FROM surveys')).toEqual(before);
    expect(db('PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);

    server.inside('rm', filler());
    const taken = await analyst.post(`/api/sites/${siteId}/surveys`, { name: 'Room again', startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' });
    expect(taken.status).toBe(201);
  });

  it('rolls back the file whose import fills the disk, marks the upload failed, and leaves the database sound', async () => {
    // 100,000 readings: a series of 800 KB, where the disk has 256 KB left (the upload's own rows fit).
    const file = longModelAFile(tag, 100_000);
    leave(256 * 1024);
    const sent = await upload(analyst, surveyId, [file]);
    expect(sent.status).toBe(201);
    const done = await settled(analyst, sent.body.id, 60_000);
    expect(done.status).toBe('failed');
    expect(done.error).toBe(IMPORT_STOPPED_FULL);
    const [row] = done.files as { status: string; testCount: number; problems: { code: string; message: string }[] }[];
    // Failed, not left pending: a pending copy would make the same file sent again a "duplicate".
    expect(row).toMatchObject({ status: 'failed', testCount: 0, problems: [{ code: 'import-stopped', message: IMPORT_STOPPED_FULL }] });
    expect(db(`SELECT COUNT(*) AS n FROM tests WHERE upload_id = ${sent.body.id}`)).toEqual([{ n: 0 }]);
    expect(db(`SELECT COUNT(*) AS n FROM test_series s JOIN tests t ON t.id = s.test_id WHERE t.upload_id = ${sent.body.id}`)).toEqual([{ n: 0 }]);
    expect(db('PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);
    expect(server.log(), 'the import was stopped by the full disk').toMatch(new RegExp(`Upload ${sent.body.id} failed[\\s\\S]*SQLITE_FULL`));

    // Space freed, the same file sent again is imported.
    server.inside('rm', filler());
    const again = await settled(analyst, (await upload(analyst, surveyId, [file])).body.id, 60_000);
    expect(again.status).toBe('done');
    expect((again.files as { status: string; testCount: number }[])[0]).toMatchObject({ status: 'processed', testCount: 1 });
  });
});

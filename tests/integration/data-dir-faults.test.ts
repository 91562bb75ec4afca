// The upload store on a disk that fills up mid-file, or that turns read-only: the upload is
// refused with a status and message saying so, nothing of it stays on disk or in the database,
// and the same upload goes through once the disk is fixed. The store is a real tmpfs in the
// server's own mount namespace (tests/support/confined-server.ts), not a mocked file system.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { kibOnTmpfs, startConfinedServer, type ConfinedServer } from '../support/confined-server';
import { Client, DEMO, signedIn } from '../support/http';
import { runDb, tempDb } from '../support/own-server';
import { modelAFileFor, settled, upload, type FilePart } from '../support/uploads';

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
});

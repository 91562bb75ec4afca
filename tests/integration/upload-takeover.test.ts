// Several instances share one database (README, "Many sites, one database"): an upload whose
// worker is silent for long is taken over by another instance. Should the silent one have been
// only slow, not gone, it must write nothing more of that upload once it is taken over — no file
// imported twice, no count added twice — and the instance that took it over finishes it.
// The other instance is played here by the database itself: its claim written as it would.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn } from '../support/http';
import { queryDb as query, runDb, startServer, tempDb, type OwnServer } from '../support/own-server';
import { settled, startLargeUpload } from '../support/uploads';

/** A time as Sequelize writes it, which both SQLite (text) and PostgreSQL (timestamptz) read. */
const stamp = (ms: number) => new Date(ms).toISOString().replace('T', ' ').replace('Z', ' +00:00');

type UploadRow = { status: string; claimed_by: string | null; files_done: number; files_total: number; test_count: number };

describe('an upload taken over from a slow instance', () => {
  let server: OwnServer;
  let dbPath: string;
  beforeAll(async () => {
    dbPath = tempDb('takeover');
    runDb('migrate', dbPath);
    runDb('seed', dbPath);
    server = await startServer(dbPath);
  });
  afterAll(() => {
    server?.process.kill('SIGKILL');
  });

  it('writes nothing more once taken over, and the taker imports the rest exactly once', async () => {
    const analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    const { files, uploadId } = await startLargeUpload(analyst, 'FV', 'takeover');
    const uploadRow = async () => (await query<UploadRow>(dbPath, `SELECT status, claimed_by, files_done, files_total, test_count FROM uploads WHERE id = ${uploadId}`))[0];
    const testsStored = async () => Number((await query<{ n: number }>(dbPath, `SELECT COUNT(*) AS n FROM tests WHERE upload_id = ${uploadId}`))[0].n);

    // Another instance takes the upload over, as its worker's claim does.
    await query(dbPath, `UPDATE uploads SET claimed_by = 'another-instance', claimed_at = '${stamp(Date.now())}' WHERE id = ${uploadId}`);
    const atTakeover = await uploadRow();
    const testsAtTakeover = await testsStored();
    expect(atTakeover.files_done, 'the import finished before the takeover: make the upload larger').toBeLessThan(files.length);

    // The slow instance goes on reading, but writes nothing more of this upload, and does not mark it failed.
    await new Promise((r) => setTimeout(r, 4000));
    expect(await uploadRow()).toEqual(atTakeover);
    expect(await testsStored()).toBe(testsAtTakeover);
    expect(server.log()).toContain(`Upload ${uploadId} was taken over by another instance`);

    // The other instance goes silent for good: the upload is free to take again, and this
    // instance, restarted, takes it and imports what is left.
    await query(dbPath, `UPDATE uploads SET claimed_at = '${stamp(Date.now() - 3_600_000)}' WHERE id = ${uploadId}`);
    server.process.kill('SIGKILL');
    await new Promise((r) => server.process.once('exit', r));
    server = await startServer(dbPath);
    const again = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    const detail = await settled(again, uploadId, 120_000);
    expect(detail.status).toBe('done');
    expect(detail.files.every((f: { status: string; testCount: number }) => f.status === 'processed' && f.testCount === 1)).toBe(true);
    expect(await testsStored()).toBe(files.length);
    const done = await uploadRow();
    expect({ filesDone: Number(done.files_done), testCount: Number(done.test_count) }).toEqual({ filesDone: files.length, testCount: files.length });
  }, 240_000);
});

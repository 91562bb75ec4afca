// Killing the server (SIGKILL) in the middle of an import: after a restart the upload is
// resumed, no test is half-written or doubled, and the original files are intact.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn } from '../support/http';
import { queryDb as query, runDb, startServer, tempDb, type OwnServer } from '../support/own-server';
import { settled, startLargeUpload } from '../support/uploads';

describe('an import interrupted by a crash', () => {
  let server: OwnServer;
  let dbPath: string;
  beforeAll(async () => {
    dbPath = tempDb('restart');
    runDb('migrate', dbPath);
    runDb('seed', dbPath);
    server = await startServer(dbPath);
  });
  afterAll(() => {
    server?.process.kill('SIGKILL');
  });

  it('resumes after SIGKILL with every file imported once and nothing half-written', async () => {
    const analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    // Killed once some files are in and some are not.
    const { files, uploadId } = await startLargeUpload(analyst, 'FV', 'crash');
    server.process.kill('SIGKILL');
    await new Promise((r) => server.process.once('exit', r));
    const atKill = await query<{ status: string; n: number }>(dbPath, `SELECT status, COUNT(*) AS n FROM source_files WHERE upload_id = ${uploadId} GROUP BY status`);
    const pendingAtKill = atKill.find((r) => r.status === 'pending')?.n ?? 0;
    expect(pendingAtKill, 'the import finished before the kill: make the upload larger').toBeGreaterThan(0);
    // No file is half-written: a file has all its tests (one) or none, and only imported files have any.
    const perFile = await query<{ status: string; tests: number }>(dbPath,
      `SELECT f.status, (SELECT COUNT(*) FROM tests t WHERE t.source_file_id = f.id) AS tests FROM source_files f WHERE f.upload_id = ${uploadId}`);
    for (const f of perFile) expect(f.tests).toBe(f.status === 'processed' ? 1 : 0);

    server = await startServer(dbPath);
    const again = await signedIn(DEMO.analyst.email, DEMO.analyst.password, server.baseUrl);
    const detail = await settled(again, uploadId, 120_000);
    expect(detail.status).toBe('done');
    expect(detail.files.every((f: { status: string; testCount: number }) => f.status === 'processed' && f.testCount === 1)).toBe(true);
    const [{ n }] = await query<{ n: number }>(dbPath, `SELECT COUNT(*) AS n FROM tests WHERE upload_id = ${uploadId}`);
    expect(n).toBe(files.length);
    // The originals are kept as received.
    const store = path.join(path.dirname(dbPath), 'uploads');
    for (const f of files.slice(0, 25)) {
      const sha = createHash('sha256').update(f.bytes as string).digest('hex');
      expect(fs.readFileSync(path.join(store, sha.slice(0, 2), sha), 'utf8')).toBe(f.bytes);
    }
  }, 240_000);
});

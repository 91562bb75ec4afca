// npm run db:backup against the app tier's live database while the server runs, then
// npm run db:restore into a fresh directory: every table's row count and every stored file's
// SHA-256 must be the same in the restored copy (issue 7, "Faults").
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { describe, expect, inject, it } from 'vitest';
import { signedIn, DEMO } from '../support/http';

const root = path.resolve(__dirname, '../..');

function script(name: string, args: string[], env: NodeJS.ProcessEnv) {
  const r = spawnSync(process.execPath, ['--conditions=react-server', '--import', 'tsx', `scripts/${name}`, ...args], { cwd: root, env, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${name} exited with ${r.status}:\n${r.stdout}\n${r.stderr}`);
  return r.stdout;
}

function counts(file: string): Promise<Record<string, number>> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (err) => {
      if (err) return reject(err);
      db.all("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name", async (e, rows: { name: string }[]) => {
        if (e) return reject(e);
        const out: Record<string, number> = {};
        for (const { name } of rows) {
          out[name] = await new Promise<number>((res, rej) => db.get(`SELECT COUNT(*) AS n FROM "${name}"`, (e2, row: { n: number }) => (e2 ? rej(e2) : res(row.n))));
        }
        db.close(() => resolve(out));
      });
    });
  });
}

function hashes(rootDir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      const rel = path.relative(rootDir, full);
      if (e.isDirectory()) {
        if (rel !== 'incoming') walk(full);
      } else out[rel] = createHash('sha256').update(fs.readFileSync(full)).digest('hex');
    }
  };
  walk(rootDir);
  return out;
}

describe('backup and restore', () => {
  it('backs up the live database and upload store while the server runs, and restores them whole', async () => {
    const dbPath = inject('dbPath');
    const store = path.join(path.dirname(dbPath), 'uploads');
    // The server is up and answering while the backup runs.
    const analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password);
    expect((await analyst.get('/api/sites')).status).toBe(200);

    const work = fs.mkdtempSync(path.join(os.tmpdir(), 'plumeward-backup-'));
    try {
      const env = { ...process.env, PLUMEWARD_DB: dbPath, PLUMEWARD_STORE: store };
      const folder = path.join(work, 'backup');
      const printed = script('db-backup.ts', [folder], env);
      expect(printed).toContain(`Backup folder: ${folder}`);
      // While the backup was taken the server kept answering, and it still does.
      expect((await analyst.get('/api/sites')).status).toBe(200);

      const target = path.join(work, 'restored');
      const restored = script('db-restore.ts', [folder, target], env);
      expect(restored).toContain(`PLUMEWARD_DB=${path.join(target, 'plumeward.sqlite')}`);
      expect(restored).toContain(`PLUMEWARD_STORE=${path.join(target, 'uploads')}`);

      const live = await counts(dbPath);
      const copy = await counts(path.join(target, 'plumeward.sqlite'));
      expect(Object.keys(live).length).toBeGreaterThan(10);
      expect(live.tests).toBeGreaterThan(0);
      expect(copy).toEqual(live);

      const liveFiles = hashes(store);
      expect(Object.keys(liveFiles).length).toBeGreaterThan(0);
      expect(hashes(path.join(target, 'uploads'))).toEqual(liveFiles);

      // A restore never writes over an installation.
      const again = spawnSync(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/db-restore.ts', folder, target], { cwd: root, env, encoding: 'utf8' });
      expect(again.status).toBe(1);
      expect(again.stderr).toContain('is not empty: restore into a fresh directory');
    } finally {
      fs.rmSync(work, { recursive: true, force: true });
    }
  });
});

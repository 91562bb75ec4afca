// Migrations run down and up again cleanly on a seeded database (a copy of the demo's data).
import sqlite3 from 'sqlite3';
import { describe, expect, it } from 'vitest';
import { runDb, tempDb } from '../support/own-server';

function tables(dbPath: string): Promise<string[]> {
  const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
  return new Promise((resolve, reject) => db.all("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name", (err, rows: { name: string }[]) => {
    db.close();
    return err ? reject(err) : resolve(rows.map((r) => r.name));
  }));
}

describe('migrations', () => {
  it('undo to nothing on the seeded demo, then apply again and seed again', async () => {
    const dbPath = tempDb('migrations');
    runDb('migrate', dbPath);
    runDb('seed', dbPath);
    const full = await tables(dbPath);
    expect(full).toEqual(expect.arrayContaining(['traps', 'tests', 'test_series', 'trap_verdicts', 'work_orders', 'uploads']));
    const undone = runDb('migrate:undo:all', dbPath);
    expect(undone).toContain('reverted 20261201000100-create-users-sites-memberships');
    expect(await tables(dbPath)).toEqual(['schema_migrations', 'schema_seeds']);
    runDb('migrate', dbPath);
    expect(await tables(dbPath)).toEqual(full);
  }, 120_000);
});

// Migrations run down and up again cleanly on a seeded database (a copy of the demo's data).
import { describe, expect, it } from 'vitest';
import { runDb, tableNames as tables, tempDb } from '../support/own-server';

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

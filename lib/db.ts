import 'server-only';
import fs from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import sqlite3 from 'sqlite3';

/** Where the SQLite file lives: PLUMEWARD_DB, or data/plumeward.sqlite under the working directory. */
export function databasePath(): string {
  return process.env.PLUMEWARD_DB ?? path.join(process.cwd(), 'data', 'plumeward.sqlite');
}

const PRAGMAS = 'PRAGMA journal_mode=WAL; PRAGMA synchronous=NORMAL; PRAGMA foreign_keys=ON; PRAGMA busy_timeout=10000;';

/**
 * sqlite3 with the PRAGMAs applied to every connection before Sequelize gets it. Sequelize opens a
 * separate connection per transaction and its SQLite dialect runs no afterConnect hook, while
 * PRAGMAs are per connection: so the driver's own constructor sets them.
 */
class ConfiguredDatabase extends sqlite3.Database {
  constructor(file: string, mode: number, callback: (err: Error | null) => void) {
    super(file, mode, (err) => {
      if (err) return callback(err);
      this.exec(PRAGMAS, (pragmaErr) => callback(pragmaErr));
    });
  }
}
const driver = { ...sqlite3, Database: ConfiguredDatabase };

function createSequelize(file: string): Sequelize {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  return new Sequelize({
    dialect: 'sqlite',
    dialectModule: driver,
    storage: file,
    logging: false,
    // Writers take the lock when the transaction begins, so two writers queue behind busy_timeout
    // instead of one failing with SQLITE_BUSY when it upgrades a read lock.
    transactionType: Transaction.TYPES.IMMEDIATE,
    define: { underscored: true },
  });
}

const cache = globalThis as unknown as { plumewardSequelize?: Sequelize };

/** The one Sequelize instance of this process (kept on globalThis so development hot reloads reuse it). */
export const sequelize: Sequelize = cache.plumewardSequelize ?? createSequelize(databasePath());
cache.plumewardSequelize = sequelize;

const queue = globalThis as unknown as { plumewardWriteQueue?: Promise<unknown> };

/**
 * A write transaction, one at a time in this process. SQLite takes one writer anyway; letting
 * several wait inside the driver blocks libuv's few threads in busy handlers while the writer
 * holding the lock needs one of them to finish — so they queue here instead. Do not nest.
 */
export function writeTransaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
  const run = (queue.plumewardWriteQueue ?? Promise.resolve()).then(() => sequelize.transaction(work));
  queue.plumewardWriteQueue = run.catch(() => undefined);
  return run;
}

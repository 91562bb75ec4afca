import { DataTypes, type QueryInterface } from 'sequelize';

// Several app instances may share one PostgreSQL database, each with its own import worker. An
// upload being processed says which instance took it and when that instance last said it was still
// at it, so a restarting instance resumes only its own interrupted uploads, and another instance's
// are taken over only once that instance has gone quiet (lib/server/import-worker.ts).
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('uploads', 'claimed_by', { type: DataTypes.STRING(120), allowNull: true });
  await q.addColumn('uploads', 'claimed_at', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: q }: { context: QueryInterface }) {
  // SQLite drops a column by copying the table; source files and tests refer to uploads, so the
  // check of references is paused for the copy. PostgreSQL drops the column in place.
  const sqlite = q.sequelize.getDialect() === 'sqlite';
  if (sqlite) await q.sequelize.query('PRAGMA foreign_keys = OFF');
  await q.removeColumn('uploads', 'claimed_at');
  await q.removeColumn('uploads', 'claimed_by');
  if (sqlite) await q.sequelize.query('PRAGMA foreign_keys = ON');
}

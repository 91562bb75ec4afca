import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  // Cost and emission settings of a site (BRIEF §3): one row per site.
  await q.createTable('site_cost_settings', {
    id,
    site_id: { ...reference('sites', 'CASCADE'), unique: true },
    operating_hours_per_year: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 8000 },
    steam_price_per_tonne: { type: DataTypes.FLOAT, allowNull: true },
    fuel_price_per_gj: { type: DataTypes.FLOAT, allowNull: true },
    boiler_efficiency: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0.857 },
    feedwater_c: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 105 },
    fuel: { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'natural_gas' },
    co2_kg_per_gj: { type: DataTypes.FLOAT, allowNull: false },
    co2_factor_source: { type: DataTypes.STRING(300), allowNull: false },
    co2_factor_year: { type: DataTypes.INTEGER, allowNull: false },
    updated_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });

  // A published survey keeps the figures and the settings it was published with.
  await q.addColumn('surveys', 'published_summary', { type: DataTypes.JSON, allowNull: true });
  await q.addColumn('surveys', 'published_settings', { type: DataTypes.JSON, allowNull: true });
  await q.addColumn('surveys', 'published_by', reference('users', 'SET NULL', true));

  await q.createTable('work_orders', {
    id,
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    trap_id: reference('traps', 'CASCADE'),
    verdict: { type: DataTypes.STRING(24), allowNull: true },
    action: { type: DataTypes.STRING(20), allowNull: false },
    priority: { type: DataTypes.STRING(10), allowNull: false },
    priority_reason: { type: DataTypes.TEXT, allowNull: true },
    assignee_id: reference('users', 'SET NULL', true),
    due_on: { type: DataTypes.DATEONLY, allowNull: true },
    status: { type: DataTypes.STRING(12), allowNull: false },
    loss_kg_per_hour: { type: DataTypes.FLOAT, allowNull: true },
    cost_per_year: { type: DataTypes.FLOAT, allowNull: true },
    repair_cost: { type: DataTypes.FLOAT, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    done_at: { type: DataTypes.DATE, allowNull: true },
    done_by: reference('users', 'SET NULL', true),
    verified_by_test_id: reference('tests', 'SET NULL', true),
    verified_at: { type: DataTypes.DATE, allowNull: true },
    reminded_at: { type: DataTypes.DATE, allowNull: true },
    created_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });
  await q.addIndex('work_orders', ['site_id', 'status'], { name: 'work_orders_site_status' });
  await q.addIndex('work_orders', ['trap_id'], { name: 'work_orders_trap' });
  await q.addIndex('work_orders', ['assignee_id', 'status'], { name: 'work_orders_assignee_status' });

  // Technicians' notes on a trap in a survey, optionally tied to a test, with an optional photo.
  await q.createTable('field_notes', {
    id,
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    trap_id: reference('traps', 'CASCADE'),
    test_id: reference('tests', 'SET NULL', true),
    kind: { type: DataTypes.STRING(24), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: true },
    photo_sha256: { type: DataTypes.STRING(64), allowNull: true },
    photo_type: { type: DataTypes.STRING(40), allowNull: true },
    created_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });
  await q.addIndex('field_notes', ['survey_id', 'trap_id'], { name: 'field_notes_survey_trap' });

  // Single-use invitations sent by e-mail; only the token's hash is kept.
  await q.createTable('invitations', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    site_ids: { type: DataTypes.JSON, allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('invitations');
  await q.dropTable('field_notes');
  await q.dropTable('work_orders');
  // SQLite drops a column by copying the table; other tables refer to surveys, so the check of
  // references is paused for the copy (this connection only; no transaction is open here).
  // PostgreSQL drops a column in place (ALTER TABLE … DROP COLUMN, its foreign key with it).
  const sqlite = q.sequelize.getDialect() === 'sqlite';
  if (sqlite) await q.sequelize.query('PRAGMA foreign_keys = OFF');
  await q.removeColumn('surveys', 'published_by');
  await q.removeColumn('surveys', 'published_settings');
  await q.removeColumn('surveys', 'published_summary');
  if (sqlite) await q.sequelize.query('PRAGMA foreign_keys = ON');
  await q.dropTable('site_cost_settings');
}

import type { QueryInterface } from 'sequelize';

// At most one active work order per trap and survey (open, scheduled, done or re-opened; a
// verified one is closed, and a trap that fails again gets a new order). The service checks this
// before it makes an order; the index makes it hold when two instances make one at once.
// SQLite and PostgreSQL both take a partial unique index in the same words.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query("CREATE UNIQUE INDEX work_orders_one_active ON work_orders (survey_id, trap_id) WHERE status <> 'verified'");
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query('DROP INDEX work_orders_one_active');
}

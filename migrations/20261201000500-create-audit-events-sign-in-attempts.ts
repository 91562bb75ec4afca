import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('audit_events', {
    id,
    user_id: reference('users', 'SET NULL', true),
    site_id: reference('sites', 'CASCADE', true),
    action: { type: DataTypes.STRING(60), allowNull: false },
    entity_type: { type: DataTypes.STRING(40), allowNull: false },
    entity_id: { type: DataTypes.INTEGER, allowNull: true },
    before: { type: DataTypes.JSON, allowNull: true },
    after: { type: DataTypes.JSON, allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('audit_events', ['entity_type', 'entity_id'], { name: 'audit_events_entity' });
  await q.addIndex('audit_events', ['site_id', 'created_at'], { name: 'audit_events_site_time' });

  await q.createTable('sign_in_attempts', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('sign_in_attempts', ['email', 'created_at'], { name: 'sign_in_attempts_email_time' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('sign_in_attempts');
  await q.dropTable('audit_events');
}

import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'active' },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.createTable('sites', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    code: { type: DataTypes.STRING(12), allowNull: false, unique: true },
    time_zone: { type: DataTypes.STRING(64), allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    unit_system: { type: DataTypes.STRING(8), allowNull: false },
    ambient_c: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 20 },
    ...timestamps,
  });
  await q.createTable('site_memberships', {
    id,
    user_id: reference('users', 'CASCADE'),
    site_id: reference('sites', 'CASCADE'),
    ...timestamps,
  });
  await q.addIndex('site_memberships', ['user_id', 'site_id'], { unique: true, name: 'site_memberships_user_site' });
  await q.addIndex('site_memberships', ['site_id'], { name: 'site_memberships_site' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('site_memberships');
  await q.dropTable('sites');
  await q.dropTable('users');
}

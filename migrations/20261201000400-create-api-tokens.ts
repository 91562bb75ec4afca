import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('api_tokens', {
    id,
    user_id: reference('users', 'CASCADE'),
    name: { type: DataTypes.STRING(80), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    read_only: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    site_ids: { type: DataTypes.JSON, allowNull: true },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('api_tokens', ['user_id'], { name: 'api_tokens_user' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('api_tokens');
}

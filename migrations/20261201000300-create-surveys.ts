import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('surveys', {
    id,
    site_id: reference('sites', 'CASCADE'),
    name: { type: DataTypes.STRING(120), allowNull: false },
    starts_on: { type: DataTypes.DATEONLY, allowNull: false },
    ends_on: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'planned' },
    published_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('surveys', ['site_id', 'starts_on'], { name: 'surveys_site_starts' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('surveys');
}

import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('areas', {
    id,
    site_id: reference('sites', 'CASCADE'),
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('areas', ['site_id', 'name'], { unique: true, name: 'areas_site_name' });

  await q.createTable('traps', {
    id,
    site_id: reference('sites', 'CASCADE'),
    area_id: reference('areas', 'SET NULL', true),
    tag: { type: DataTypes.STRING(40), allowNull: false },
    location: { type: DataTypes.STRING(200), allowNull: true },
    trap_type: { type: DataTypes.STRING(40), allowNull: false },
    application: { type: DataTypes.STRING(20), allowNull: true },
    size_dn: { type: DataTypes.INTEGER, allowNull: true },
    orifice_mm: { type: DataTypes.FLOAT, allowNull: true },
    pressure_barg: { type: DataTypes.FLOAT, allowNull: false },
    discharges_to: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'return' },
    criticality: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'normal' },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'in_service' },
    ...timestamps,
  });
  // The register list pages, sorts and filters by these on sites of 20,000 traps.
  await q.addIndex('traps', ['site_id', 'tag'], { unique: true, name: 'traps_site_tag' });
  await q.addIndex('traps', ['site_id', 'area_id'], { name: 'traps_site_area' });
  await q.addIndex('traps', ['site_id', 'trap_type'], { name: 'traps_site_type' });
  await q.addIndex('traps', ['site_id', 'status'], { name: 'traps_site_status' });
  await q.addIndex('traps', ['site_id', 'pressure_barg'], { name: 'traps_site_pressure' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('traps');
  await q.dropTable('areas');
}

import { DataTypes } from 'sequelize';

// Column shapes shared by migrations. A migration's schema is frozen once it has run somewhere,
// so later migrations must not change these; add new helpers instead.
export const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
export const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
export function reference(table: string, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT', allowNull = false) {
  return { type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' }, onDelete, onUpdate: 'CASCADE' };
}

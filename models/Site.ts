import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { UnitSystem } from '@/lib/domain/vocabulary';

export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare code: string;
  declare timeZone: string;
  declare currency: string;
  declare unitSystem: UnitSystem;
  declare ambientC: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Site.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    code: { type: DataTypes.STRING(12), allowNull: false, unique: true },
    timeZone: { type: DataTypes.STRING(64), allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    unitSystem: { type: DataTypes.STRING(8), allowNull: false },
    ambientC: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 20 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'sites' },
);

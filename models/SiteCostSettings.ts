import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Site } from './Site';
import type { User } from './User';

/** How a site prices lost steam and counts its CO2 (BRIEF §3). */
export class SiteCostSettings extends Model<InferAttributes<SiteCostSettings>, InferCreationAttributes<SiteCostSettings>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare operatingHoursPerYear: number;
  declare steamPricePerTonne: number | null;
  declare fuelPricePerGj: number | null;
  declare boilerEfficiency: number;
  declare feedwaterC: number;
  declare fuel: string;
  declare co2KgPerGj: number;
  declare co2FactorSource: string;
  declare co2FactorYear: number;
  declare updatedBy: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SiteCostSettings.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    siteId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    operatingHoursPerYear: { type: DataTypes.FLOAT, allowNull: false },
    steamPricePerTonne: { type: DataTypes.FLOAT, allowNull: true },
    fuelPricePerGj: { type: DataTypes.FLOAT, allowNull: true },
    boilerEfficiency: { type: DataTypes.FLOAT, allowNull: false },
    feedwaterC: { type: DataTypes.FLOAT, allowNull: false },
    fuel: { type: DataTypes.STRING(40), allowNull: false },
    co2KgPerGj: { type: DataTypes.FLOAT, allowNull: false },
    co2FactorSource: { type: DataTypes.STRING(300), allowNull: false },
    co2FactorYear: { type: DataTypes.INTEGER, allowNull: false },
    updatedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'site_cost_settings' },
);

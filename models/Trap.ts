import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model, NonAttribute,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type {
  Application, Criticality, DischargesTo, TrapStatus, TrapType,
} from '@/lib/domain/vocabulary';
import type { Area } from './Area';
import type { Site } from './Site';

export class Trap extends Model<InferAttributes<Trap>, InferCreationAttributes<Trap>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare areaId: ForeignKey<Area['id']> | null;
  declare tag: string;
  declare location: CreationOptional<string | null>;
  declare trapType: TrapType;
  declare application: CreationOptional<Application | null>;
  declare sizeDn: CreationOptional<number | null>;
  declare orificeMm: CreationOptional<number | null>;
  declare pressureBarg: number;
  declare dischargesTo: CreationOptional<DischargesTo>;
  declare criticality: CreationOptional<Criticality>;
  declare status: CreationOptional<TrapStatus>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare area?: NonAttribute<Area | null>;
}

Trap.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    tag: { type: DataTypes.STRING(40), allowNull: false },
    location: { type: DataTypes.STRING(200), allowNull: true },
    trapType: { type: DataTypes.STRING(40), allowNull: false },
    application: { type: DataTypes.STRING(20), allowNull: true },
    sizeDn: { type: DataTypes.INTEGER, allowNull: true },
    orificeMm: { type: DataTypes.FLOAT, allowNull: true },
    pressureBarg: { type: DataTypes.FLOAT, allowNull: false },
    dischargesTo: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'return' },
    criticality: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'normal' },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'in_service' },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'traps' },
);

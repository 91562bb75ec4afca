import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { InstrumentProfile as ProfileDefinition } from '@/lib/import/instrument-profile';
import type { User } from './User';

/** A saved meter layout. Shared by every site of the installation: a meter model reads the same everywhere. */
export class InstrumentProfile extends Model<InferAttributes<InstrumentProfile>, InferCreationAttributes<InstrumentProfile>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare fingerprint: string;
  declare definition: ProfileDefinition;
  /** Moves on every edit; each source file records the revision it was read with. */
  declare revision: CreationOptional<number>;
  declare createdBy: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

InstrumentProfile.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    fingerprint: { type: DataTypes.STRING(40), allowNull: false },
    definition: { type: DataTypes.JSON, allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'instrument_profiles' },
);

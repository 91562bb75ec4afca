import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { User } from './User';

export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare name: string;
  /** SHA-256 of the secret, hex. The secret itself is shown once and never stored. */
  declare tokenHash: string;
  /** The first characters of the secret, so people can tell their tokens apart. */
  declare prefix: string;
  declare readOnly: CreationOptional<boolean>;
  /** Sites the token is limited to; null means all of the owner's sites. JSON array of ids. */
  declare siteIds: CreationOptional<number[] | null>;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

ApiToken.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(80), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    readOnly: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    siteIds: { type: DataTypes.JSON, allowNull: true },
    lastUsedAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'api_tokens' },
);

import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Site } from './Site';
import type { User } from './User';

export class SiteMembership extends Model<InferAttributes<SiteMembership>, InferCreationAttributes<SiteMembership>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare siteId: ForeignKey<Site['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SiteMembership.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'site_memberships' },
);

import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Site } from './Site';
import type { User } from './User';

/** One change to a record: who, when, what, from what, to what, and why. Append-only. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']> | null;
  declare siteId: ForeignKey<Site['id']> | null;
  declare action: string;
  declare entityType: string;
  declare entityId: number | null;
  declare before: CreationOptional<Record<string, unknown> | null>;
  declare after: CreationOptional<Record<string, unknown> | null>;
  declare reason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

AuditEvent.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    entityType: { type: DataTypes.STRING(40), allowNull: false },
    entityId: { type: DataTypes.INTEGER, allowNull: true },
    before: { type: DataTypes.JSON, allowNull: true },
    after: { type: DataTypes.JSON, allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'audit_events', updatedAt: false },
);

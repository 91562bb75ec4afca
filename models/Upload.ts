import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { UploadStatus } from '@/lib/domain/vocabulary';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { User } from './User';

/** One upload of many files into a survey; processed in the background. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare createdBy: ForeignKey<User['id']> | null;
  declare status: UploadStatus;
  declare filesTotal: CreationOptional<number>;
  declare filesDone: CreationOptional<number>;
  declare testCount: CreationOptional<number>;
  declare sampleCount: CreationOptional<number>;
  declare error: CreationOptional<string | null>;
  /** The mapping wizard's saved state, so a refresh or a colleague's link resumes it. */
  declare mappingDraft: CreationOptional<Record<string, unknown> | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  /** The import worker's instance that took the upload, and when it last said it was still at it. */
  declare claimedBy: CreationOptional<string | null>;
  declare claimedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Upload.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    status: { type: DataTypes.STRING(24), allowNull: false },
    filesTotal: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    filesDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    testCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sampleCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    mappingDraft: { type: DataTypes.JSON, allowNull: true },
    startedAt: { type: DataTypes.DATE, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    claimedBy: { type: DataTypes.STRING(120), allowNull: true },
    claimedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'uploads' },
);

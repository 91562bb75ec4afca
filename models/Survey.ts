import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { SurveyStatus } from '@/lib/domain/vocabulary';
import type { Site } from './Site';

export class Survey extends Model<InferAttributes<Survey>, InferCreationAttributes<Survey>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare name: string;
  /** Calendar dates (YYYY-MM-DD) in the site's time zone. */
  declare startsOn: string;
  declare endsOn: string;
  declare status: CreationOptional<SurveyStatus>;
  declare publishedAt: CreationOptional<Date | null>;
  /** Frozen at publishing: the survey's figures, and the cost settings and parameters that made them. */
  declare publishedSummary: CreationOptional<Record<string, unknown> | null>;
  declare publishedSettings: CreationOptional<Record<string, unknown> | null>;
  declare publishedBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Survey.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    startsOn: { type: DataTypes.DATEONLY, allowNull: false },
    endsOn: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'planned' },
    publishedAt: { type: DataTypes.DATE, allowNull: true },
    publishedSummary: { type: DataTypes.JSON, allowNull: true },
    publishedSettings: { type: DataTypes.JSON, allowNull: true },
    publishedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'surveys' },
);
